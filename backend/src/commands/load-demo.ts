import { QueryTypes, type Sequelize } from 'sequelize';
import { DEMO_POLLSTERS, generateDemo } from '@veracast/database';
import { ChangeLogModel, ElectionModel } from '../db/models';
import { importResults } from './imports/results';
import { importPolls } from './imports/polls';
import { normalizeName } from './imports/csv';

/**
 * Loads the fictional demo scenario through the same import code a user's file goes through,
 * registering each demo firm's aliases first, and marks its elections as fictional.
 * Does nothing when any election exists already.
 */
export async function loadDemo(sequelize: Sequelize, userId: number | null): Promise<{ loaded: boolean; polls: number }> {
  if ((await ElectionModel.count()) > 0) return { loaded: false, polls: 0 };
  const demo = generateDemo();
  for (const firm of DEMO_POLLSTERS) {
    const [id] = await sequelize.query('INSERT INTO pollsters (name) VALUES (:name)', { replacements: { name: firm.name }, type: QueryTypes.INSERT });
    for (const alias of firm.aliases) {
      await sequelize.query('INSERT IGNORE INTO pollster_aliases (pollster_id, alias, normalized) VALUES (:id, :alias, :norm)', {
        replacements: { id, alias, norm: normalizeName(alias) },
      });
    }
  }
  const common = { userId, userRole: 'admin' as const, reason: 'Demo scenario' };
  const results = await importResults(sequelize, Buffer.from(demo.resultsCsv), { ...common, fileName: 'demo-results.csv' });
  if (results.httpStatus !== 201) throw new Error(`demo results did not import: ${JSON.stringify(results.errors.slice(0, 5))}`);
  const polls = await importPolls(sequelize, Buffer.from(demo.pollsCsv), { ...common, fileName: 'demo-polls.csv' });
  if (polls.httpStatus !== 201) throw new Error(`demo polls did not import: ${JSON.stringify(polls.errors.slice(0, 5))}`);
  // The demo loads only into an empty archive, so every election now present is the demo's.
  await ElectionModel.update({ fictional: true }, { where: {} });
  // As a reviewer would: orient every general election the same way (Oakbound against Lantern) and
  // the referendum YES against NO, so signed errors compare across elections.
  for (const e of await ElectionModel.findAll()) {
    const [blocA, blocB] = e.key.endsWith('-referendum') ? ['YES', 'NO'] : ['OAK', 'LAN'];
    await e.update({ blocA, blocB });
    await ChangeLogModel.create({ entity: 'election', entityKey: e.key, action: 'set_orientation', userId, reason: 'Demo scenario: one orientation across elections', beforeValue: null, afterValue: JSON.stringify({ blocA, blocB }) });
  }
  return { loaded: true, polls: polls.created };
}
