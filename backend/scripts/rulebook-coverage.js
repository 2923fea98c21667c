#!/usr/bin/env node
// npm run rulebook:coverage — the rulebook's coverage, as GET /api/rulebook/coverage gives it: jurisdictions × topics,
// each cell sourced / secondary / partly / not on file, the counts and the oldest as-of date.
// With DATABASE_URL: the current versions in that database; without: the shipped data files (rule version 1).
const { isFactRecord, rulebookCoverage, formatCoverage, RULEBOOK_DATA } = require('../../common/dist');

async function main() {
  let records;
  let from;
  if (process.env.DATABASE_URL) {
    const { Client } = require('pg');
    const c = new Client({ connectionString: process.env.DATABASE_URL });
    await c.connect();
    const { rows } = await c.query(
      `SELECT v.version, v.record FROM jurisdictions j JOIN rule_versions v ON v.code = j.code AND v.version = j.current_version ORDER BY j.code`,
    );
    await c.end();
    records = rows.filter((r) => isFactRecord(r.record)).map((r) => ({ record: r.record, version: r.version }));
    from = `current versions in ${process.env.DATABASE_URL.replace(/\/\/[^@]*@/, '//')}`;
  } else {
    records = Object.values(RULEBOOK_DATA).map((record) => ({ record, version: 1 }));
    from = 'the shipped data files (common/src/rulebook/data)';
  }
  console.log(`Rulebook coverage — ${from}`);
  console.log(formatCoverage(rulebookCoverage(records)));
}
main().catch((e) => {
  console.error(e.message);
  process.exit(1);
});
