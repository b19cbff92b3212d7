import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';

type G = typeof globalThis & { __hearthcastOrm?: Promise<MikroORM> };
const g = globalThis as G;

/** One ORM per process (kept on globalThis so dev reloads reuse it). */
export function getOrm(): Promise<MikroORM> {
  g.__hearthcastOrm ??= MikroORM.init(config).catch((err: unknown) => {
    g.__hearthcastOrm = undefined;
    throw err;
  });
  return g.__hearthcastOrm;
}

/** A fresh entity manager for one request or job. */
export async function getEm(): Promise<EntityManager> {
  return (await getOrm()).em.fork();
}

export async function closeOrm(): Promise<void> {
  if (g.__hearthcastOrm) {
    const orm = await g.__hearthcastOrm;
    g.__hearthcastOrm = undefined;
    await orm.close(true);
  }
}
