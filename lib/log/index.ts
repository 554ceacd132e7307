import 'server-only';
export { log, componentLogger, runLogger, requestLogger, logLevel } from './logger';
export { REQUEST_ID_HEADER, isSaneRequestId, requestIdFrom } from './request-id';
export { withLogContext, currentLogContext } from './context';
