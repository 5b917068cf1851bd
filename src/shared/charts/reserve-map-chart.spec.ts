import { TestBed } from '@angular/core/testing';
import { hsl, interpolateCividis } from 'd3';
import { ReserveMapChart, type ReserveMapData } from './reserve-map-chart';

describe('ReserveMapChart', () => {
  async function render(data: ReserveMapData) {
    TestBed.configureTestingModule({ imports: [ReserveMapChart] });
    const fixture = TestBed.createComponent(ReserveMapChart);
    fixture.componentRef.setInput('data', data);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  // a 4 × 3 grid with one land cell and a 2-cell reserve
  const grid: ReserveMapData = {
    nx: 4, ny: 3, h: 2, cells: [0, 1, 2, 4, 5, 6, 7, 8, 9, 10, 11], reserve: [0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0],
    density: [10, 20, 30, 40, 90, 80, 50, 5, 0, 15, 25], max: 100, unit: 't/km²',
  };

  it('draws one cell per habitable cell, darker for lower density, and outlines the reserve on every side', async () => {
    const svg = (await render(grid)).querySelector('svg')!;
    const rects = svg.querySelectorAll('.cells rect');
    expect(rects.length).toBe(11);
    // cividis lightness rises with density, so the map reads in grey (Nuñez, Anderton & Renslow 2018, PLoS ONE 13:e0199239)
    const light = (i: number) => hsl(rects[i]!.getAttribute('fill')!).l;
    expect(light(4)).toBeGreaterThan(light(0));
    expect(light(0)).toBeGreaterThan(light(8));
    expect(hsl(interpolateCividis(0)).l).toBeLessThan(hsl(interpolateCividis(1)).l);
    // two reserve cells side by side: 6 outer edges, drawn twice (white halo and dashed line)
    expect(svg.querySelectorAll('.reserve-outline line').length).toBe(12);
  });

  it('labels the legend with the density unit and the coast axis in km', async () => {
    const coast: ReserveMapData = { nx: 10, ny: 1, h: 3, cells: [...Array(10).keys()], reserve: [0, 0, 0, 1, 1, 1, 0, 0, 0, 0], density: Array(10).fill(50), max: 100, unit: 't/km' };
    const svg = (await render(coast)).querySelector('svg')!;
    expect(svg.querySelector('.legend')!.textContent).toContain('100 t/km');
    expect(svg.querySelector('.legend')!.textContent).toContain('Reserve');
    expect(svg.textContent).toContain('Along the coast (km)');
    expect(svg.textContent).toContain('30');
  });
});
