/**
 * One log line per API request, when its answer has gone: method, path, status and time taken. Nothing from
 * the headers, so session cookies never reach the log. Unlike a per-request child logger this builds nothing
 * for the request up front, which matters on the reads every open plan makes.
 */
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The server's logger, for the error handler. */
      log?: Logger;
    }
  }
}

export function requestLog(log: Logger, prefix = '/api'): RequestHandler {
  return (req, res, next) => {
    req.log = log;
    if (!req.url.startsWith(prefix) || !log.isLevelEnabled('info')) return next();
    const started = performance.now();
    const done = () => {
      res.off('finish', done);
      res.off('close', done);
      log.info(
        {
          // The path without its query: what was asked for, not what was sent with it.
          req: { method: req.method, url: req.originalUrl.split('?', 1)[0] },
          res: { statusCode: res.statusCode },
          responseTime: Math.round(performance.now() - started),
        },
        res.writableFinished ? 'request completed' : 'request aborted',
      );
    };
    res.on('finish', done);
    res.on('close', done);
    next();
  };
}
