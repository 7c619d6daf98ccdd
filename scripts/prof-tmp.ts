import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '/work/main/mikro-orm.config';
import { UserSchema, OrganisationSchema } from '/work/main/entities';
import { getOrgContextOrThrow } from '/work/main/lib/server/org-context';
import { Effects } from '/work/main/lib/server/unit-of-work';
import { listFleet } from '/work/main/lib/server/services/assets/list-fleet';

const orm = await MikroORM.init(ormConfig(process.env.DATABASE_URL!));
const em0 = orm.em.fork();
const user = await em0.findOneOrFail(UserSchema, { email: 'owner@gullhaven.example' });
const N = Number(process.env.N ?? 200);
const query = { page: 1, pageSize: 50, dir: 'asc', archived: '0' } as any;
async function once() {
  const em = orm.em.fork();
  return em.transactional(async (tx) => {
    const ctx = await getOrgContextOrThrow(tx as any, { id: user.id, email: user.email, name: user.name } as any, 'gullhaven', null, new Effects());
    return listFleet(ctx, query);
  });
}
for (let i = 0; i < 20; i++) await once();
const t0 = performance.now();
const cpu0 = process.cpuUsage();
for (let i = 0; i < N; i++) await once();
const cpu = process.cpuUsage(cpu0);
console.log(`wall ${((performance.now() - t0) / N).toFixed(2)} ms/call, cpu ${((cpu.user + cpu.system) / 1000 / N).toFixed(2)} ms/call`);
await orm.close(true);
