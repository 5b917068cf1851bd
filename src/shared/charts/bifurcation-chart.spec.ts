import { TestBed } from '@angular/core/testing';
import { BifurcationChart, type BifurcationData } from './bifurcation-chart';

// Logistic with r = 0.4, K = 1000: the engine's fold is h* = rK/4 = 100 at B = K/2 (Clark 1990).
function logisticTable() {
  return Array.from({ length: 21 }, (_, i) => {
    const h = (100 * i) / 20;
    const s = Math.sqrt(1 - h / 100);
    return { h, stable: 500 * (1 + s), unstable: 500 * (1 - s), returnRate: 0.4 * s };
  });
}

describe('BifurcationChart', () => {
  async function render(data: BifurcationData) {
    TestBed.configureTestingModule({ imports: [BifurcationChart] });
    const fixture = TestBed.createComponent(BifurcationChart);
    fixture.componentRef.setInput('data', data);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const data: BifurcationData = {
    table: logisticTable(), hStar: 100, bFold: 500, band: { p5: 90, p95: 108 },
    catches: [{ year: 2020, catch: 60 }, { year: 2021, catch: 75 }], quota: 85, unit: 't',
  };

  function xOf(svg: SVGSVGElement, h: number): number {
    const [d0, d1] = svg.getAttribute('data-x-domain')!.split(',').map(Number);
    const [r0, r1] = svg.getAttribute('data-x-range')!.split(',').map(Number);
    return r0! + ((h - d0!) / (d1! - d0!)) * (r1! - r0!);
  }

  it('draws the fold marker at the engine\'s fold harvest and biomass', async () => {
    const el = await render(data);
    const svg = el.querySelector('svg')!;
    const marker = svg.querySelector('.fold-marker')!;
    expect(Number(marker.getAttribute('data-h'))).toBe(100);
    expect(Number(marker.getAttribute('cx'))).toBeCloseTo(xOf(svg, 100), 6);
    expect(svg.textContent).toContain('Fold h* = 100');
  });

  it('draws the stable branch solid, the unstable dashed, the fold band shaded and the quota line where given', async () => {
    const el = await render(data);
    const svg = el.querySelector('svg')!;
    expect(svg.querySelector('.stable-branch')!.getAttribute('stroke-dasharray')).toBeNull();
    expect(svg.querySelector('.unstable-branch')!.getAttribute('stroke-dasharray')).toBe('6 4');
    const band = svg.querySelector('.fold-band')!;
    expect(Number(band.getAttribute('x'))).toBeCloseTo(xOf(svg, 90), 6);
    expect(Number(svg.querySelector('.quota-line')!.getAttribute('x1'))).toBeCloseTo(xOf(svg, 85), 6);
    expect(svg.querySelectorAll('.catches line').length).toBe(2);
  });

  it('leaves out the band and quota line when the run has neither', async () => {
    const el = await render({ ...data, band: null, quota: null });
    expect(el.querySelector('.fold-band')).toBeNull();
    expect(el.querySelector('.quota-line')).toBeNull();
  });
});
