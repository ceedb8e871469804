// Direct access to the e2e run's demo database, for tests that need a commission of their own.
import pg from "pg";

export async function withDb<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/**
 * A fresh commission at the demo studio for one of its clients (by e-mail), numbered after the
 * studio's last, so a test never shares a commission with another file. Returns its id.
 */
export async function insertDemoCommission(
  client: pg.Client,
  opts: { clientEmail: string; title: string; garment?: "hat" | "mittens" | "pullover"; state?: string; neededBy?: string | null; brief?: Record<string, unknown> },
): Promise<string> {
  const s = await client.query<{ id: string; no: number }>(
    "update studios set next_commission_no = next_commission_no + 1 where slug = 'hollin-knitworks' returning id, next_commission_no - 1 as no",
  );
  const c = await client.query<{ id: string }>(
    `insert into commissions (studio_id, client_id, number, title, garment, wearer, state, needed_by, currency, brief)
     select $1, sc.id, $2, $3, $4, 'adult', $5, $6, 'GBP', $7::jsonb
     from studio_clients sc join "user" u on u.id = sc.user_id where sc.studio_id = $1 and u.email = $8
     returning id`,
    [s.rows[0].id, s.rows[0].no, opts.title, opts.garment ?? "hat", opts.state ?? "enquiry", opts.neededBy ?? null, JSON.stringify(opts.brief ?? {}), opts.clientEmail],
  );
  return c.rows[0].id;
}
