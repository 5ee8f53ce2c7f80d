import nodemailer, { type Transporter } from 'nodemailer';
import type { ServerConfig } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Sends e-mail. `send` resolves false (and logs) when the relay refuses: a mail failure never undoes the work that caused it. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<boolean>;
  close(): void;
}

/** nodemailer over plain SMTP to the configured host: the local sink in development, a real relay by setting SMTP_HOST. */
export class SmtpMailer implements Mailer {
  private readonly transport: Transporter;

  constructor(
    smtp: ServerConfig['smtp'],
    private readonly from: string,
    private readonly log: (message: string) => void = console.error,
  ) {
    this.transport = nodemailer.createTransport({
      host: smtp.host,
      port: smtp.port,
      secure: smtp.secure,
      // The sink speaks plain SMTP on loopback; a real relay is reached with SMTP_SECURE=1 and credentials.
      ignoreTLS: !smtp.secure,
      auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10000,
    });
  }

  async send(mail: OutgoingMail): Promise<boolean> {
    try {
      await this.transport.sendMail({ from: this.from, ...mail });
      return true;
    } catch (error) {
      this.log(`mail: could not send "${mail.subject}" to ${mail.to}: ${(error as Error).message}`);
      return false;
    }
  }

  close(): void {
    this.transport.close();
  }
}
