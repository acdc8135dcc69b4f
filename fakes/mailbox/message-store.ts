export interface MailMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** When the mailbox received the message, ISO 8601. */
  date: string;
}

/** Received messages in memory, newest first; the oldest fall out once `capacity` is reached. */
export class MessageStore {
  private items: MailMessage[] = [];

  constructor(private readonly capacity: number) {}

  add(message: MailMessage): void {
    this.items.unshift(message);
    if (this.items.length > this.capacity) {
      this.items.length = this.capacity;
    }
  }

  /** All messages, or those with `recipient` among their recipients (compared without regard to case). */
  list(recipient?: string): MailMessage[] {
    if (recipient === undefined) {
      return [...this.items];
    }
    const wanted = recipient.trim().toLowerCase();
    return this.items.filter((message) =>
      message.to.some((address) => address.toLowerCase() === wanted),
    );
  }

  get(id: string): MailMessage | undefined {
    return this.items.find((message) => message.id === id);
  }

  get size(): number {
    return this.items.length;
  }

  clear(): number {
    const cleared = this.items.length;
    this.items = [];
    return cleared;
  }
}
