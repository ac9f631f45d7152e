import { QueryTypes, type Sequelize } from 'sequelize';

/** Requests turned into resets per statement; the delivery loop repeats until none is left. */
const BATCH = 50;

/**
 * Turns queued password reset requests (migration 0013) into a reset and a pending
 * mail where an account has the address, and drops every other request, in one
 * statement: claimed with SKIP LOCKED so several processes share the rows. The request
 * itself did the same work for every address; only this step, after the answer, knows
 * whether an account exists. A request past its link's expiry is dropped unsent.
 * Returns how many requests were taken.
 */
export async function releaseResetRequests(sequelize: Sequelize): Promise<number> {
  let taken = 0;
  for (;;) {
    const [row] = await sequelize.query<{ taken: number }>(
      `WITH requested AS (
         DELETE FROM password_reset_requests
          WHERE id IN (SELECT id FROM password_reset_requests ORDER BY requested_at LIMIT $batch FOR UPDATE SKIP LOCKED)
         RETURNING id, email, expires_at, mail),
       reset AS (
         INSERT INTO password_resets (id, user_id, expires_at, created_at)
         SELECT r.id, u.id, r.expires_at, now()
           FROM requested r JOIN users u ON u.email = r.email
          WHERE r.expires_at > now()
         RETURNING id),
       queued AS (
         INSERT INTO outbox (message_id, envelope_from, envelope_to, from_header, to_header, subject,
                             text_body, html_body, size_bytes, state, next_attempt_at)
         SELECT m.message_id, m.envelope_from, m.envelope_to, m.from_header, m.to_header, m.subject,
                m.text_body, m.html_body, m.size_bytes, 'pending', now()
           FROM requested r JOIN reset ON reset.id = r.id,
                LATERAL jsonb_populate_record(NULL::outbox, r.mail) m
         RETURNING id)
       SELECT (SELECT count(*) FROM requested)::int AS taken`,
      { bind: { batch: BATCH }, type: QueryTypes.SELECT },
    );
    taken += row.taken;
    if (row.taken < BATCH) return taken;
  }
}
