/** A message caught by the local mail service, as the dev mailbox shows it. */
export type CapturedMailView = {
  id: string;
  receivedAt: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  kind: string | null;
};

/** An outbox row not yet delivered. */
export type WaitingMailView = {
  id: number;
  kind: string;
  to: string;
  subject: string;
  status: 'pending' | 'failed';
  attempts: number;
  nextAttemptAt: string;
  lastError: string | null;
};

export type OutboxOverview = { pending: number; sent: number; failed: number; waiting: WaitingMailView[] };
