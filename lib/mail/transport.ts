/**
 * The SMTP transport: nodemailer to SMTP_URL (a local fake in development and tests,
 * smtp://127.0.0.1:2525 by default). One transport per process.
 */
import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

export const MAIL_FROM = env.MAIL_FROM;

let cached: Transporter | undefined;

export function mailTransport(): Transporter {
  cached ??= nodemailer.createTransport(env.SMTP_URL, { from: MAIL_FROM });
  return cached;
}
