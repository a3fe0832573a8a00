import nodemailer from 'nodemailer';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Sends mail from the app. Resolves once the SMTP server accepted the message. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

/** A Mailer speaking plain SMTP (no TLS, no auth) to a local server such as the mail fake. */
export function createSmtpMailer(options: { host?: string; port: number; from: string }): Mailer {
  const transport = nodemailer.createTransport({
    host: options.host ?? '127.0.0.1',
    port: options.port,
    secure: false,
    ignoreTLS: true,
  });
  return {
    async send(message) {
      await transport.sendMail({ from: options.from, ...message });
    },
    close() {
      transport.close();
    },
  };
}
