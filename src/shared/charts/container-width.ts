import { DestroyRef, ElementRef, Signal, afterNextRender, computed, inject, signal } from '@angular/core';

/**
 * The width a chart should draw at: the width of its host element, measured with a ResizeObserver,
 * capped at the chart's designed width. Call in a component's constructor; the host must be a block.
 */
export function containerWidth(designed: () => number): Signal<number> {
  const host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  const measured = signal(0);
  const observer = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver((entries) => {
    const w = Math.floor(entries[0]?.contentRect.width ?? 0);
    if (w > 0 && w !== measured()) measured.set(w);
  });
  afterNextRender(() => observer?.observe(host));
  inject(DestroyRef).onDestroy(() => observer?.disconnect());
  return computed(() => {
    const w = measured();
    return w > 0 ? Math.max(280, Math.min(w, designed())) : designed();
  });
}

/** A chart height for a drawing width: the designed height, shortened on narrow screens. */
export function heightFor(width: number, designed: number): number {
  return Math.round(Math.min(designed, Math.max(260, width * 0.8)));
}
