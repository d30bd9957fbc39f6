/**
 * The local fake mail server as a process of its own: `tsx server/dev/mail-catcher.ts <folder> <port>`.
 * The local cluster (db/cluster/mail-catcher.ts) runs one beside its instances, which start as
 * production does and so need an SMTP_URL (server/config.ts); what they send lands in `<folder>`
 * as the development mailbox reads it (server/dev/mailbox.ts). Stops on SIGTERM or SIGINT.
 */
import { startFakeSmtp } from './fake-smtp';

if (require.main === module) {
  const [dir, portText] = process.argv.slice(2);
  const port = Number(portText);
  if (!dir || !Number.isInteger(port) || port < 1 || port > 65535) {
    console.error('Usage: tsx server/dev/mail-catcher.ts <folder> <port>');
    process.exit(2);
  }
  startFakeSmtp({ dir, port }).then(
    (smtp) => {
      console.log(`Fake mail server on ${smtp.url}; messages in ${dir}`);
      const stop = () => void smtp.stop().then(() => process.exit(0));
      process.once('SIGTERM', stop);
      process.once('SIGINT', stop);
    },
    (error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    },
  );
}
