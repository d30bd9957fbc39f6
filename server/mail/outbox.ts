/**
 * Outgoing mail. One outbox per process, set up by `createApp` from the configuration, so
 * that services (and the revision workflow, after its transaction) can send without carrying
 * the transport around. Sending never throws: a mail that cannot go out is logged, and the
 * request that caused it still succeeds.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { ServerConfig } from '../config';
import type { LogPseudonym } from '../logging/log-pseudonym';

export interface OutgoingMail {
  /** One recipient per message: nobody sees who else was told. */
  to: string;
  subject: string;
  text: string;
}

export class Outbox {
  constructor(
    private readonly transport: Transporter | undefined,
    private readonly from: string,
    private readonly publicUrl: string,
    private readonly logger: Logger,
    /** Recipients are logged by pseudonym only (logging/log-pseudonym.ts). */
    private readonly pseudonym: LogPseudonym,
  ) {}

  /** Sends one message; resolves `false` (and logs why) when it could not be handed over. */
  async send(mail: OutgoingMail): Promise<boolean> {
    if (!this.transport) {
      this.logger.warn({ to: this.pseudonym(mail.to.toLowerCase()), subject: mail.subject }, 'mail not sent: SMTP_URL is not set');
      return false;
    }
    try {
      await this.transport.sendMail({ from: this.from, to: mail.to, subject: mail.subject, text: mail.text });
      this.logger.info({ to: this.pseudonym(mail.to.toLowerCase()), subject: mail.subject }, 'mail sent');
      return true;
    } catch (error) {
      this.logger.error({ err: error, to: this.pseudonym(mail.to.toLowerCase()), subject: mail.subject }, 'mail could not be sent');
      return false;
    }
  }

  /** An absolute link into the web app; `fragment` stays in the browser (never in server logs). */
  link(path: string, fragment?: Record<string, string>): string {
    const url = new URL(path, this.publicUrl.endsWith('/') ? this.publicUrl : `${this.publicUrl}/`);
    if (fragment) url.hash = new URLSearchParams(fragment).toString();
    return url.toString();
  }

  /** For the logs of callers that send after the response. */
  get log(): Logger {
    return this.logger;
  }
}

/** Without a pseudonym function (a command-line tool without SESSION_SECRET), recipients are not logged at all. */
const UNNAMED: LogPseudonym = () => '[address]';

export function createOutbox(config: Pick<ServerConfig, 'SMTP_URL' | 'MAIL_FROM' | 'PUBLIC_URL' | 'MAILBOX_DIR'>, logger: Logger, pseudonym: LogPseudonym = UNNAMED): Outbox {
  const transport = config.SMTP_URL
    ? nodemailer.createTransport({
        url: config.SMTP_URL,
        // The fake mailbox offers no TLS; a real server is told by smtps:// or STARTTLS.
        ignoreTLS: Boolean(config.MAILBOX_DIR),
        connectionTimeout: 10_000,
        greetingTimeout: 10_000,
        socketTimeout: 20_000,
      } as Parameters<typeof nodemailer.createTransport>[0])
    : undefined;
  return new Outbox(transport, config.MAIL_FROM, config.PUBLIC_URL, logger.child({ component: 'mail' }), pseudonym);
}

let current: Outbox | undefined;

export function setOutbox(outbox: Outbox): void {
  current = outbox;
}

/** The process's outbox; throws if `createApp` has not run (a programming error, not bad input). */
export function outbox(): Outbox {
  if (!current) throw new Error('The outbox is not set up: createApp() sets it.');
  return current;
}
