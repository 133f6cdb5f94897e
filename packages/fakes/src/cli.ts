/** Run the local fakes on their own: `npm run dev -w @gloaming/fakes`. */
import { startMailCatcher } from './mail-catcher';

const catcher = await startMailCatcher({
  smtpPort: Number(process.env.SMTP_PORT ?? 1025),
  webPort: Number(process.env.GLOAMING_INBOX_PORT ?? 1080),
});
console.log(`SMTP catcher on ${catcher.host}:${catcher.smtpPort}; inbox at http://${catcher.host}:${catcher.webPort}/`);
const stop = () => void catcher.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
