import { QueryTypes, type Sequelize } from 'sequelize';
import type { Mailer } from './mail-service';
import { releaseResetRequests } from './reset-requests';

export interface DeliveryOptions {
  /** How often the queue is looked at when nothing wakes the loop (other processes' mail, retries). */
  pollMs: number;
  /** Rows claimed per round. */
  batch: number;
  /** After this many failed attempts a message is marked failed and left alone. */
  maxAttempts: number;
  /** The wait after the first failure; it doubles with each further one, up to `maxBackoffMs`. */
  backoffMs: number;
  maxBackoffMs: number;
  /**
   * How long a claimed row stays out of other processes' reach while this one talks
   * SMTP; longer than the mailer's timeouts, so only a process that died mid-send lets
   * another one try again.
   */
  leaseMs: number;
}

export const DEFAULT_DELIVERY: DeliveryOptions = {
  pollMs: 2_000,
  batch: 20,
  maxAttempts: 10,
  backoffMs: 2_000,
  maxBackoffMs: 15 * 60 * 1000,
  leaseMs: 2 * 60 * 1000,
};

export interface RoundResult {
  delivered: number;
  retrying: number;
  failed: number;
}

export interface MailDelivery {
  /** Run a round now (after a commit that queued mail). */
  wake(): void;
  /** Rounds until nothing is due; what they did. */
  drain(): Promise<RoundResult>;
  stop(): Promise<void>;
}

/** The wait before attempt `attempts + 1`, after `attempts` failures. */
export const backoffAfter = (attempts: number, options: Pick<DeliveryOptions, 'backoffMs' | 'maxBackoffMs'>): number =>
  Math.min(options.backoffMs * 2 ** Math.max(0, attempts - 1), options.maxBackoffMs);

interface ClaimedRow {
  id: string;
  message_id: string;
  envelope_to: string[];
  from_header: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attempts: number;
}

/**
 * The delivery loop. A round claims due rows in one statement (FOR UPDATE SKIP LOCKED,
 * so several API processes share the queue without sending a message twice) and pushes
 * their next attempt past the lease; the claim commits before any SMTP, so no database
 * connection is held while a mail server answers. Each outcome is one more statement.
 */
export function startMailDelivery(
  sequelize: Sequelize,
  mailer: Mailer,
  overrides: Partial<DeliveryOptions> = {},
): MailDelivery {
  const options = { ...DEFAULT_DELIVERY, ...overrides };
  let running: Promise<RoundResult> | null = null;
  let timer: NodeJS.Timeout | null = null;
  let stopped = false;
  let lastProblem = '';

  async function claim(): Promise<ClaimedRow[]> {
    return sequelize.query<ClaimedRow>(
      `UPDATE outbox o
          SET attempts = o.attempts + 1, next_attempt_at = now() + make_interval(secs => $lease)
        WHERE o.id IN (SELECT id FROM outbox
                        WHERE state = 'pending' AND next_attempt_at <= now()
                        ORDER BY next_attempt_at, id
                        LIMIT $batch
                        FOR UPDATE SKIP LOCKED)
        RETURNING o.id, o.message_id, o.envelope_to, o.from_header, o.subject, o.text_body, o.html_body, o.attempts`,
      { bind: { lease: options.leaseMs / 1000, batch: options.batch }, type: QueryTypes.SELECT },
    );
  }

  async function deliver(row: ClaimedRow): Promise<keyof RoundResult> {
    try {
      await mailer.send({
        messageId: row.message_id,
        to: row.envelope_to,
        from: row.from_header,
        subject: row.subject,
        text: row.text_body,
        html: row.html_body,
      });
    } catch (error) {
      const reason = (error instanceof Error ? error.message : String(error)).slice(0, 500);
      const giveUp = row.attempts >= options.maxAttempts;
      await sequelize.query(
        giveUp
          ? `UPDATE outbox SET state = 'failed', next_attempt_at = NULL, last_error = $reason WHERE id = $id`
          : `UPDATE outbox SET next_attempt_at = now() + make_interval(secs => $wait), last_error = $reason WHERE id = $id`,
        { bind: { id: row.id, reason, ...(giveUp ? {} : { wait: backoffAfter(row.attempts, options) / 1000 }) } },
      );
      return giveUp ? 'failed' : 'retrying';
    }
    await sequelize.query(
      `UPDATE outbox SET state = 'delivered', delivered_at = now(), next_attempt_at = NULL WHERE id = $id`,
      { bind: { id: row.id } },
    );
    return 'delivered';
  }

  async function round(): Promise<RoundResult> {
    const result: RoundResult = { delivered: 0, retrying: 0, failed: 0 };
    // Reset requests become mail here, after their answers (see reset-requests.ts).
    await releaseResetRequests(sequelize);
    for (;;) {
      const rows = await claim();
      if (rows.length === 0) return result;
      for (const outcome of await Promise.all(rows.map(deliver))) result[outcome] += 1;
    }
  }

  function schedule(delay: number): void {
    if (stopped) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => void run(), delay);
    timer.unref();
  }

  function run(): Promise<RoundResult> {
    running ??= round()
      .then(
        (result) => {
          lastProblem = '';
          return result;
        },
        (error: unknown) => {
          // The database may be away (the soak's outage); the rows wait, the loop goes on.
          const message = error instanceof Error ? error.message : String(error);
          if (message !== lastProblem) console.error('[mail-delivery]', message);
          lastProblem = message;
          return { delivered: 0, retrying: 0, failed: 0 };
        },
      )
      .finally(() => {
        running = null;
        schedule(options.pollMs);
      });
    return running;
  }

  schedule(0);
  return {
    wake: () => schedule(0),
    async drain() {
      const total: RoundResult = { delivered: 0, retrying: 0, failed: 0 };
      if (running) await running;
      for (;;) {
        const result = await run();
        total.delivered += result.delivered;
        total.retrying += result.retrying;
        total.failed += result.failed;
        if (result.delivered + result.retrying + result.failed === 0) return total;
      }
    },
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      if (running) await running;
    },
  };
}
