import crypto from 'node:crypto';

/** A Message-ID made once per outbox row, so every attempt at delivering it carries the same one. */
export function newMessageId(domain = 'swapyard.invalid'): string {
  return `<${crypto.randomBytes(16).toString('hex')}@${domain}>`;
}
