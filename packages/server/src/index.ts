// Public surface of the server package (used by tests/ and bench/).
export { createApp, type AppDeps } from './app.js';
export { DEFAULT_CONFIG, type AppConfig } from './config.js';
export { HttpError } from './http/httpError.js';
export { requireAuth, requireRole, type SessionUser } from './auth/requireRole.js';
export { createSmtpMailer, type Mailer, type MailMessage } from './mail/mailer.js';
export { startMailFake, type MailFake } from './mail/startMailFake.js';
