/**
 * Structured request logs: one pino line per finished request with method,
 * url, status and duration in ms (499 when the client left before the
 * answer). Bodies and headers are not logged (they may hold a user's
 * unpublished data).
 */
import type { NextFunction, Request, Response } from 'express';
import { pino, type Logger } from 'pino';

/** The default logger: JSON lines on stdout at level "info" (FIELDGAP_LOG_LEVEL overrides). */
export function createLogger(level = process.env['FIELDGAP_LOG_LEVEL'] ?? 'info'): Logger {
  return pino({ level, base: { service: 'fieldgap' } });
}

const MAX_URL_LENGTH = 500;

export function requestLogger(logger: Logger) {
  return (req: Request, res: Response, next: NextFunction): void => {
    const started = process.hrtime.bigint();
    const line = (status: number) => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      const url = req.originalUrl.length > MAX_URL_LENGTH ? `${req.originalUrl.slice(0, MAX_URL_LENGTH)}...` : req.originalUrl;
      return { method: req.method, url, status, ms: Math.round(ms * 100) / 100 };
    };
    res.once('finish', () => {
      if (res.statusCode >= 500) logger.warn(line(res.statusCode), 'request');
      else logger.info(line(res.statusCode), 'request');
    });
    res.once('close', () => {
      // 499: the client closed the connection before the answer (a common log convention).
      if (!res.writableFinished) logger.info({ ...line(499), aborted: true }, 'request');
    });
    next();
  };
}
