/** Reads the messages the local fake SMTP server captured (development and tests only). */
import "server-only";
import { readFile } from "node:fs/promises";
import path from "node:path";

export interface CapturedMail {
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
}

/** The captured messages, newest first (empty when the fake is not running or has received nothing). */
export async function capturedMail(limit = 200): Promise<CapturedMail[]> {
  const file = process.env.MAIL_CAPTURE_FILE ?? path.join(process.cwd(), ".data", "mail", "captured.jsonl");
  try {
    const lines = (await readFile(file, "utf8")).split("\n").filter(Boolean);
    return lines
      .slice(-limit)
      .reverse()
      .map((l) => {
        const m = JSON.parse(l);
        return { receivedAt: m.receivedAt, to: m.to, subject: m.subject, text: m.text };
      });
  } catch {
    return [];
  }
}
