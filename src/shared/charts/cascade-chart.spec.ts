import { TestBed } from '@angular/core/testing';
import { CascadeChart, type CascadeChartData } from './cascade-chart';

describe('CascadeChart', () => {
  async function render(data: CascadeChartData) {
    TestBed.configureTestingModule({ imports: [CascadeChart] });
    const fixture = TestBed.createComponent(CascadeChart);
    fixture.componentRef.setInput('data', data);
    await fixture.whenStable();
    return fixture.nativeElement.querySelector('svg') as SVGSVGElement;
  }
  const xOf = (svg: SVGSVGElement, c: number) => {
    const [d0, d1] = svg.getAttribute('data-x-domain')!.split(',').map(Number);
    const [r0, r1] = svg.getAttribute('data-x-range')!.split(',').map(Number);
    return r0! + ((c - d0!) / (d1! - d0!)) * (r1! - r0!);
  };
  // Ricker r = 2.5 under harvest: period 2 below u = 1 − e^(−0.5) ≈ 0.393 (May 1976), stable above
  const data: CascadeChartData = {
    columns: [0, 0.2, 0.4, 0.6, 0.8].map((c) => ({ c, states: c < 0.39 ? [400, 1600] : [1000], regime: c < 0.39 ? 'cycle' : 'stable' })),
    doublings: [0.3935], chaosOnset: null, proposed: 0.7, band: [0.62, 0.75], xLabel: 'Harvest rate', yLabel: 'Stock (t)', percent: true,
  };

  it('plots every long-run state and marks the doubling, the proposed rate and its band where the engine put them', async () => {
    const svg = await render(data);
    expect(svg.querySelectorAll('.states circle').length).toBe(7);
    expect(Number(svg.querySelector('.doubling')!.getAttribute('x1'))).toBeCloseTo(xOf(svg, 0.3935), 6);
    expect(Number(svg.querySelector('.proposed')!.getAttribute('x1'))).toBeCloseTo(xOf(svg, 0.7), 6);
    expect(Number(svg.querySelector('.band')!.getAttribute('x'))).toBeCloseTo(xOf(svg, 0.62), 6);
    expect(svg.textContent).toContain('Proposed 70%');
  });

  it('draws no proposed rate or band on a productivity diagram', async () => {
    const svg = await render({ ...data, proposed: null, band: null, percent: false });
    expect(svg.querySelector('.proposed')).toBeNull();
    expect(svg.querySelector('.band')).toBeNull();
  });
});
