/** Data access for saved link budgets (Knex only). */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface LinkBudgetRow {
  id: string;
  bench_id: string;
  created_by: string | null;
  name: string;
  input: string | object;
  result: string | object;
  created_at: Date;
}

export type LinkBudgetRowWithName = LinkBudgetRow & { created_by_name: string | null };

const COLUMNS = ['b.id', 'b.bench_id', 'b.created_by', 'b.name', 'b.input', 'b.result', 'b.created_at', 'u.name as created_by_name'];

export async function insertLinkBudget(db: Knex, row: Omit<LinkBudgetRow, 'input' | 'result'> & { input: object; result: object }): Promise<void> {
  await db('link_budgets').insert({ ...row, input: JSON.stringify(row.input), result: JSON.stringify(row.result) });
}

export async function listLinkBudgets(db: Knex, benchId: string): Promise<LinkBudgetRowWithName[]> {
  return db('link_budgets as b')
    .leftJoin('users as u', 'u.id', 'b.created_by')
    .where('b.bench_id', benchId)
    .orderBy([
      { column: 'b.created_at', order: 'desc' },
      { column: 'b.id', order: 'desc' },
    ])
    .select(COLUMNS);
}

/** One budget with the caller's role on its bench (null: not a member). */
export async function findLinkBudgetForUser(
  db: Knex,
  id: string,
  userId: string,
): Promise<(LinkBudgetRowWithName & { role: BenchRole | null }) | undefined> {
  return db('link_budgets as b')
    .leftJoin('users as u', 'u.id', 'b.created_by')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'b.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('b.id', id)
    .first([...COLUMNS, 'm.role as role']);
}

export async function findLinkBudget(db: Knex, id: string): Promise<LinkBudgetRowWithName | undefined> {
  return db('link_budgets as b').leftJoin('users as u', 'u.id', 'b.created_by').where('b.id', id).first(COLUMNS);
}

export async function deleteLinkBudget(db: Knex, id: string): Promise<void> {
  await db('link_budgets').where({ id }).delete();
}
