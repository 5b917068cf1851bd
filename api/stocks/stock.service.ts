/** Stocks, as each role may see them: licensees only their own region's. */
import { NotFoundError } from '../http/http-error';
import type { Page, PageRequest } from '../http/paging';
import { Region } from '../regions/region.model';
import { Stock } from './stock.model';
import type { StockView } from './stock.schemas';

function scope(viewer: Express.User): Record<string, unknown> {
  return viewer.role === 'licensee' ? { regionId: viewer.regionId ?? -1 } : {};
}

/** One page of the stocks this person may see, by name. */
export async function listStocks(viewer: Express.User, page: PageRequest = { limit: 100, offset: 0 }): Promise<{ stocks: StockView[]; page: Page }> {
  const { rows, count } = await Stock.findAndCountAll({
    where: scope(viewer), include: [{ model: Region, as: 'region' }], order: [['name', 'ASC'], ['id', 'ASC']], limit: page.limit, offset: page.offset,
  });
  return { stocks: rows.map((s) => s.toView()), page: { ...page, total: count } };
}

/** One stock, or NotFoundError when it does not exist or is outside this person's view. */
export async function getStock(viewer: Express.User, id: number): Promise<StockView> {
  const s = await Stock.findOne({ where: { id, ...scope(viewer) }, include: [{ model: Region, as: 'region' }] });
  if (!s) throw new NotFoundError('Stock');
  return s.toView();
}
