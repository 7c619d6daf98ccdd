import nodemailer, { type Transporter } from 'nodemailer';
import { getEnv } from '../env';

let transporter: Transporter | undefined;

// Plain SMTP to the configured relay (the local fake in development and tests).
export function getTransport(): Transporter {
  if (!transporter) {
    const env = getEnv();
    transporter = nodemailer.createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: false,
      ignoreTLS: env.TIDEWARDEN_ENV !== 'production',
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10000,
    });
  }
  return transporter;
}
