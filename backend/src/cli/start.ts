import { ConfigError, loadConfig } from '../config';
import { ensureFirstAdmin, startServer } from '../bootstrap';
import { loadDemo } from '../commands/load-demo';
import { UserModel } from '../db/models';

async function main() {
  const config = loadConfig();
  const running = await startServer(config, {
    async afterMigrate(ctx) {
      const admin = await ensureFirstAdmin(config);
      if (admin?.generatedPassword) {
        console.log('\n  First admin created. Sign in with:');
        console.log(`    e-mail:   ${admin.email}`);
        console.log(`    password: ${admin.generatedPassword}`);
        console.log('  This password is shown only once; change it after signing in.\n');
      } else if (admin) {
        ctx.logger.info(`first admin ${admin.email} created from ADMIN_PASSWORD`);
      }
      if (config.LOAD_DEMO) {
        const owner = await UserModel.findOne({ where: { role: 'admin' }, order: [['id', 'ASC']] });
        const started = Date.now();
        const demo = await loadDemo(ctx.sequelize, owner?.id ?? null);
        if (demo.loaded) console.log(`  Loaded the fictional demo scenario (${demo.polls} polls) in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
      }
    },
  });
  console.log(`Veracast is serving on ${running.url}`);
  const stop = () => {
    running.close().finally(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: unknown) => {
  if (err instanceof ConfigError) console.error(err.message);
  else console.error(err);
  process.exit(1);
});
