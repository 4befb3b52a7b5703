import nodemailer, { type Transporter } from 'nodemailer';

export function createTransport(smtpUrl: string): Transporter {
  return nodemailer.createTransport(smtpUrl, { connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 10_000 } as never);
}
