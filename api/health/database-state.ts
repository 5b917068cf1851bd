/** Whether an error means "the database cannot be reached" (answer 503 and retry) rather than a bug or bad input. */
import { ConnectionError, TimeoutError } from 'sequelize';

const CONNECTION_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND',
  'ER_SOCKET_UNEXPECTED_CLOSE', 'ER_CONNECTION_ALREADY_CLOSED', 'ER_GET_CONNECTION_TIMEOUT', 'ER_CONNECTION_TIMEOUT',
  'ER_CMD_CONNECTION_CLOSED', 'ER_POOL_ALREADY_CLOSED', 'ER_CLOSING_POOL', 'ER_SERVER_SHUTDOWN', 'ER_CON_COUNT_ERROR',
  'PROTOCOL_CONNECTION_LOST',
]);

interface DriverError { code?: string; fatal?: boolean; sqlState?: string; errno?: number }

function driverDown(e: DriverError | undefined): boolean {
  if (!e) return false;
  // SQLSTATE class 08 is "connection exception"; 1053 is "server shutdown in progress"
  return e.fatal === true || CONNECTION_CODES.has(e.code ?? '') || (e.sqlState ?? '').startsWith('08') || e.errno === 1053;
}

/** True for a lost, refused or timed-out database connection, however the driver or Sequelize wrapped it. */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  if (err instanceof ConnectionError || err instanceof TimeoutError) return true;
  const e = err as DriverError & { parent?: DriverError; original?: DriverError; cause?: DriverError; name?: string };
  if (e.name === 'SequelizeConnectionError' || e.name?.startsWith('SequelizeConnection')) return true;
  return driverDown(e.parent) || driverDown(e.original) || driverDown(e.cause) || (e.name === 'SqlError' && driverDown(e));
}
