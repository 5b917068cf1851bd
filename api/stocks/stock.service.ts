/** Stocks, as each role may see them: licensees only their own region's. */
import { NotFoundError } from '../http/http-error';
import { Region } from '../regions/region.model';
import { Stock } from './stock.model';
import type { StockView } from './stock.schemas';

function scope(viewer: Express.User): Record<string, unknown> {
  return viewer.role === 'licensee' ? { regionId: viewer.regionId ?? -1 } : {};
}

/** The stocks this person may see, by name. */
export async function listStocks(viewer: Express.User): Promise<StockView[]> {
  const rows = await Stock.findAll({ where: scope(viewer), include: [{ model: Region, as: 'region' }], order: [['name', 'ASC']] });
  return rows.map((s) => s.toView());
}

/** One stock, or NotFoundError when it does not exist or is outside this person's view. */
export async function getStock(viewer: Express.User, id: number): Promise<StockView> {
  const s = await Stock.findOne({ where: { id, ...scope(viewer) }, include: [{ model: Region, as: 'region' }] });
  if (!s) throw new NotFoundError('Stock');
  return s.toView();
}
