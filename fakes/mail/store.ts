// The catcher keeps mail in memory only: it is a development and test stand-in, and a restart should
// give an empty inbox, just as a fresh test run expects.

/** One message as the catcher caught it. `date` is when it arrived (ISO 8601), which orders the inbox. */
export type CaughtMail = {
  id: string;
  /** Address from the From header, or the SMTP envelope sender when the header is missing. */
  from: string;
  /** Addresses from the To header, or the envelope recipients when the header is missing. */
  to: string[];
  cc: string[];
  /** Every RCPT TO of the SMTP session: includes Bcc recipients that no header shows. */
  envelopeTo: string[];
  subject: string;
  date: string;
  /** The date the sender wrote in the Date header, if any (ISO 8601). */
  sentDate: string | null;
  messageId: string | null;
  text: string | null;
  html: string | null;
  links: string[];
  /** Size of the raw message in bytes as received over SMTP. */
  size: number;
};

export const DEFAULT_MAX_MESSAGES = 500;

export type MailStore = {
  add(mail: Omit<CaughtMail, 'id'>): CaughtMail;
  /** Newest first. */
  list(filter?: { to?: string }): CaughtMail[];
  get(id: string): CaughtMail | undefined;
  remove(id: string): boolean;
  clear(): number;
};

function normaliseAddress(address: string): string {
  return address.trim().toLowerCase();
}

/** Matches a recipient whether they were in To, Cc or only on the envelope (Bcc). */
export function isAddressedTo(mail: CaughtMail, address: string): boolean {
  const wanted = normaliseAddress(address);
  return [...mail.to, ...mail.cc, ...mail.envelopeTo].some((candidate) => normaliseAddress(candidate) === wanted);
}

export function createMailStore(maxMessages = DEFAULT_MAX_MESSAGES): MailStore {
  if (!Number.isInteger(maxMessages) || maxMessages < 1) {
    throw new RangeError(`maxMessages must be a positive integer, got ${maxMessages}`);
  }
  // Oldest first internally; ids never restart after clear() so a stale id cannot point at new mail.
  let messages: CaughtMail[] = [];
  let nextId = 1;

  return {
    add(mail) {
      const caught: CaughtMail = { id: String(nextId++), ...mail };
      messages.push(caught);
      // Drop the oldest beyond the cap so a long-running dev catcher cannot grow without bound.
      if (messages.length > maxMessages) messages = messages.slice(messages.length - maxMessages);
      return caught;
    },
    list(filter = {}) {
      const { to } = filter;
      const matching = to ? messages.filter((mail) => isAddressedTo(mail, to)) : messages;
      return [...matching].reverse();
    },
    get(id) {
      return messages.find((mail) => mail.id === id);
    },
    remove(id) {
      const before = messages.length;
      messages = messages.filter((mail) => mail.id !== id);
      return messages.length < before;
    },
    clear() {
      const count = messages.length;
      messages = [];
      return count;
    },
  };
}
