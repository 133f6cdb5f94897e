export { startMailCatcher, type MailCatcher, type CaughtMessage, type MailCatcherOptions } from './mail-catcher';
