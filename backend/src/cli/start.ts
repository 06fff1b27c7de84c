import { ConfigError, loadConfig } from '../config';
import { ensureFirstAdmin, startServer } from '../bootstrap';

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
