// Usage: tsx db/migrate.ts up | down | status
import { getSequelize, closeSequelize } from './connection';
import { createMigrator } from './migrator';

async function main(): Promise<void> {
  const command = process.argv[2] ?? 'up';
  const migrator = createMigrator(getSequelize());
  if (command === 'up') {
    const done = await migrator.up();
    console.log(done.length ? `Migrated: ${done.map((m) => m.name).join(', ')}` : 'Database schema is up to date');
  } else if (command === 'down') {
    const undone = await migrator.down();
    console.log(`Reverted: ${undone.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (command === 'status') {
    console.log('Applied:', (await migrator.executed()).map((m) => m.name));
    console.log('Pending:', (await migrator.pending()).map((m) => m.name));
  } else {
    throw new Error(`Unknown command "${command}": use up, down or status`);
  }
}

main()
  .catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
