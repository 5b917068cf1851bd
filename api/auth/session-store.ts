/** The session store: sessions in MariaDB (connect-session-sequelize), with the expiry refresh throttled. */
import connectSessionSequelize from 'connect-session-sequelize';
import session from 'express-session';
import type { Sequelize } from 'sequelize';

const SequelizeStore = connectSessionSequelize(session.Store);

/** How often one session's expiry is pushed forward in the table (the cookie is refreshed on every answer). */
const TOUCH_EVERY_MS = 60_000;
const REMEMBERED = 20_000;

/**
 * Sessions in the `sessions` table. A rolling session would cost one UPDATE per request (the largest
 * share of a read's database work), so one session's expiry is written at most once a minute.
 */
export function createSessionStore(sequelize: Sequelize): InstanceType<typeof SequelizeStore> {
  const store = new SequelizeStore({ db: sequelize, tableName: 'sessions', checkExpirationInterval: 15 * 60_000 });
  const touched = new Map<string, number>();
  const touch = store.touch.bind(store);
  const destroy = store.destroy.bind(store);
  store.touch = (sid, data, fn) => {
    const now = Date.now();
    const last = touched.get(sid);
    if (last !== undefined && now - last < TOUCH_EVERY_MS) return void fn?.(undefined);
    if (touched.size >= REMEMBERED) touched.clear();
    touched.set(sid, now);
    touch(sid, data, fn);
  };
  store.destroy = (sid, fn) => {
    touched.delete(sid);
    destroy(sid, fn);
  };
  return store;
}
