import { hashPassword, type Knex } from '@sagline/database';
import type { ProjectRole } from '@sagline/common/api-types';

/** The password of every factory-made account (long enough for LIMITS.passwordMin). */
export const PASSWORD = 'correct horse battery';

let sequence = 0;
let passwordHash: Promise<string> | null = null;

export interface TestUser {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

export interface TestProject {
  id: number;
  name: string;
  number: string;
  levels: { id: number; name: string; position: number }[];
}

/** Rows made directly in the database: what a test needs as its starting point. */
export class Factories {
  constructor(private readonly knex: Knex) {}

  async user(opts: { name?: string; email?: string; isAdmin?: boolean; invited?: boolean } = {}): Promise<TestUser> {
    const n = ++sequence;
    passwordHash ??= hashPassword(PASSWORD);
    const email = (opts.email ?? `person${n}.${process.pid}@firm.example`).toLowerCase();
    const [row] = await this.knex('users')
      .insert({
        email,
        name: opts.name ?? `Person ${n}`,
        password_hash: opts.invited ? null : await passwordHash,
        is_admin: opts.isAdmin ?? false,
      })
      .returning(['id', 'email', 'name', 'is_admin']);
    return { id: row.id, email: row.email, name: row.name, isAdmin: row.is_admin };
  }

  async project(opts: { name?: string; number?: string; levels?: string[]; team?: [TestUser, ProjectRole][] } = {}): Promise<TestProject> {
    const n = ++sequence;
    const [p] = await this.knex('projects')
      .insert({ name: opts.name ?? `Project ${n}`, number: opts.number ?? `P-${n}`, unit_system: 'SI' })
      .returning(['id', 'name', 'number']);
    const names = opts.levels ?? ['L1', 'L2', 'Roof'];
    const levels = await this.knex('levels')
      .insert(names.map((name, position) => ({ project_id: p.id, name, position })))
      .returning(['id', 'name', 'position']);
    for (const [user, role] of opts.team ?? []) await this.role(p.id, user, role);
    return { id: p.id, name: p.name, number: p.number, levels };
  }

  async role(projectId: number, user: TestUser, role: ProjectRole): Promise<void> {
    await this.knex('project_roles').insert({ project_id: projectId, user_id: user.id, role });
  }
}
