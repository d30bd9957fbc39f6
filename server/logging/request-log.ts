/**
 * The server's logger and its request log (pino, JSON, one line per API answer). Every line of
 * a request carries its id (`reqId`, from a well-formed `X-Request-Id` or a new UUID, sent back
 * in the answer's `x-request-id`), and once someone is signed in, their user and operator ids.
 * The serializers (`log-serializers.ts`) keep personal data out.
 */
import { randomUUID } from 'node:crypto';
import { pino, type Logger, type LoggerOptions } from 'pino';
import type { Options } from 'pino-http';
import { errorSerializer, requestSerializer, responseSerializer } from './log-serializers';
import type { LogPseudonym } from './log-pseudonym';

const REQUEST_ID = /^[A-Za-z0-9._-]{1,64}$/;

/** The process's logger: JSON lines on stdout, errors through the masking serializer. */
export function createLogger(level: LoggerOptions['level'], destination?: pino.DestinationStream): Logger {
  const options: LoggerOptions = { level, serializers: { err: errorSerializer } };
  return destination ? pino(options, destination) : pino(options);
}

/** The options of pino-http for the API's request log. */
export function requestLogOptions(logger: Logger, pseudonym: LogPseudonym): Options {
  return {
    logger,
    genReqId: (req, res) => {
      const incoming = req.headers['x-request-id'];
      const id = typeof incoming === 'string' && REQUEST_ID.test(incoming) ? incoming : randomUUID();
      res.setHeader('x-request-id', id);
      return id;
    },
    serializers: {
      req: requestSerializer(pseudonym),
      res: responseSerializer,
      err: errorSerializer,
    },
    customProps: (req) => {
      const user = (req as { user?: { id: number; operatorId: number } }).user;
      return user ? { userId: user.id, operatorId: user.operatorId } : {};
    },
    autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') },
  };
}
