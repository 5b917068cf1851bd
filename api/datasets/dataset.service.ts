/** Dataset versions: checked in full before anything is stored; every version kept, never overwritten. */
import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service';
import { HttpError, NotFoundError } from '../http/http-error';
import type { Page, PageRequest } from '../http/paging';
import { Stock } from '../stocks/stock.model';
import { userNames } from '../users/user-names';
import { csvChecker } from './csv-checker';
import { Dataset } from './dataset.model';
import type { CsvCheck, DatasetView } from './dataset.schemas';

export class DatasetService {
  constructor(private readonly sequelize: Sequelize) {}

  /** Parses a CSV without storing it (in the checker's worker thread). */
  check(csv: string): Promise<CsvCheck> {
    return csvChecker.check(csv);
  }

  /** One page of a stock's versions, newest first, without their CSV text. */
  async list(stockId: number, page: PageRequest = { limit: 50, offset: 0 }): Promise<{ datasets: DatasetView[]; page: Page }> {
    await this.stock(stockId);
    const [rows, total] = await Promise.all([
      Dataset.findAll({ where: { stockId }, order: [['version', 'DESC']], limit: page.limit, offset: page.offset, attributes: { exclude: ['csvText'] } }),
      Dataset.count({ where: { stockId } }),
    ]);
    const names = await userNames(rows.map((r) => r.createdBy));
    return { datasets: rows.map((r) => r.toView(names.get(r.createdBy) ?? null)), page: { ...page, total } };
  }

  async get(id: number): Promise<{ dataset: DatasetView; check: CsvCheck; csv: string }> {
    const d = await Dataset.findByPk(id);
    if (!d) throw new NotFoundError('Dataset');
    const names = await userNames([d.createdBy]);
    return { dataset: d.toView(names.get(d.createdBy) ?? null), check: await csvChecker.check(d.csvText, { lenientNumbers: true }), csv: d.csvText };
  }

  /** Stores a clean file as the stock's next version, with its audit entry, in one transaction. */
  async create(actorId: number, stockId: number, csv: string, note: string): Promise<DatasetView> {
    const stock = await this.stock(stockId);
    const parsed = await csvChecker.check(csv);
    if (!parsed.ok) {
      throw new HttpError(422, 'DATASET_ROWS_INVALID', `The file has ${parsed.errors.length} problem(s); nothing was saved.`, undefined, { problems: parsed.errors });
    }
    if (parsed.kind !== stock.kind) {
      const want = stock.kind === 'single' ? 'a "catch" column' : '"prey_catch" and "predator_catch" columns';
      throw new HttpError(422, 'DATASET_KIND_MISMATCH', `${stock.name} is a ${stock.kind === 'single' ? 'single' : 'linked predator-prey'} stock: the file needs ${want}.`);
    }
    return this.sequelize.transaction(async (t) => {
      await Stock.findByPk(stockId, { transaction: t, lock: t.LOCK.UPDATE });
      const version = ((await Dataset.max<number, Dataset>('version', { where: { stockId }, transaction: t })) ?? 0) + 1;
      const s = parsed.series;
      const d = await Dataset.create({
        stockId, version, note, kind: parsed.kind, csvText: csv, firstYear: s.years[0]!, lastYear: s.years[s.years.length - 1]!,
        indexNames: s.stockRecruit ? ['spawners', 'recruits'] : s.indices.map((i) => i.name), createdBy: actorId,
      }, { transaction: t });
      await recordAudit({ actorId, action: 'dataset.create', entityType: 'dataset', entityId: d.id, after: { stockId, version, note, years: s.years.length } }, t);
      return d.toView();
    });
  }

  private async stock(id: number): Promise<Stock> {
    const s = await Stock.findByPk(id);
    if (!s) throw new NotFoundError('Stock');
    return s;
  }

}
