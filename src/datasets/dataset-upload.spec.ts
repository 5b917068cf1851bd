import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { of } from 'rxjs';
import type { CsvCheck } from '../../api/datasets/dataset.schemas';
import { DatasetApi } from './dataset-api';
import { DatasetUpload } from './dataset-upload';

const BAD: CsvCheck = {
  ok: false,
  header: ['year', 'catch', 'survey'],
  rows: [['1990', '100', '2.1'], ['1991', '-5', '2.3'], ['1992', '120', '2.2']],
  errors: [{ line: 3, column: 'catch', value: '-5', problem: 'A catch cannot be negative.', fix: 'Enter the removals as a positive amount, or 0.' }],
};

describe('DatasetUpload', () => {
  async function setup(check: CsvCheck) {
    const api = jasmine.createSpyObj<DatasetApi>('DatasetApi', ['checkFile', 'checkText', 'create']);
    api.checkFile.and.returnValue(of(check));
    TestBed.configureTestingModule({ imports: [DatasetUpload], providers: [{ provide: DatasetApi, useValue: api }] });
    const fixture = TestBed.createComponent(DatasetUpload);
    fixture.componentRef.setInput('stockId', 7);
    await fixture.whenStable();
    const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('[data-testid=file-input]')!;
    const transfer = new DataTransfer();
    transfer.items.add(new File(['year,catch,survey\n'], 'landings.csv', { type: 'text/csv' }));
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    return { fixture, api, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists each problem with its line, column, value, reason and fix', async () => {
    const { el, api } = await setup(BAD);
    expect(api.checkFile).toHaveBeenCalledWith(7, jasmine.any(File));
    const cells = Array.from(el.querySelectorAll('[data-testid=problem-table] tbody tr td')).map((td) => td.textContent!.trim());
    expect(cells).toEqual(['3', 'catch', '-5', 'A catch cannot be negative.', 'Enter the removals as a positive amount, or 0.']);
    expect(el.querySelector('[data-testid=check-status]')!.textContent).toContain('1 problem(s) to fix');
  });

  it('marks the offending cell and its line in the editable table, and nothing else', async () => {
    const { el } = await setup(BAD);
    const marked = Array.from(el.querySelectorAll('[data-testid=data-table] td.bm-cell-error'));
    expect(marked.length).toBe(1);
    expect((marked[0]!.querySelector('input') as HTMLInputElement).value).toBe('-5');
    expect(marked[0]!.getAttribute('title')).toBe('A catch cannot be negative.');
    expect(el.querySelectorAll('[data-testid=data-table] td.bm-row-error').length).toBe(1);
  });

  it('keeps "Save as new version" disabled while the file has problems', async () => {
    const { loader } = await setup(BAD);
    const save = await loader.getHarness(MatButtonHarness.with({ text: /Save as new version/ }));
    expect(await save.isDisabled()).toBeTrue();
  });

  it('shows a clean file as clean, with its rows', async () => {
    const { el } = await setup({ ok: true, kind: 'single', series: { years: [], catches: [], indices: [] }, header: BAD.header, rows: BAD.rows });
    expect(el.querySelector('[data-testid=check-status]')!.classList).toContain('bm-ok');
    expect(el.querySelectorAll('[data-testid=data-table] tr.mat-mdc-row').length).toBe(3);
    expect(el.querySelector('[data-testid=problem-table]')).toBeNull();
  });
});
