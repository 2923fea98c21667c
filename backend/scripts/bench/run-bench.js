// The benchmark proper: run by bench.sh against the server it started with the large dataset.
'use strict';
const { execFileSync } = require('node:child_process');
const { readFileSync, writeFileSync, existsSync, statSync } = require('node:fs');
const { join } = require('node:path');
const os = require('node:os');
const zlib = require('node:zlib');
const autocannon = require('autocannon');
const { Client } = require('pg');

const ROOT = join(__dirname, '..', '..', '..');
const BASE = `http://127.0.0.1:${process.env.PORT || 3300}`;
const DURATION = Number(process.env.BENCH_SECONDS || 5);
const CONNECTIONS = [1, 10, 50];

async function api(path, token, init = {}) {
  const res = await fetch(BASE + path, { ...init, headers: { 'content-type': 'application/json', ...(token ? { authorization: `Bearer ${token}` } : {}), ...(init.headers || {}) } });
  if (!res.ok) throw new Error(`${path}: ${res.status} ${await res.text()}`);
  return res.json();
}

function cannon(opts) {
  return new Promise((resolve, reject) => autocannon({ duration: DURATION, ...opts }, (err, r) => (err ? reject(err) : resolve(r))));
}

async function main() {
  const db = new Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const [disp] = (await db.query(`SELECT email FROM users WHERE role = 'dispatcher' AND email LIKE 'dispatcher.1@large%'`)).rows;
  const login = { email: disp.email, password: 'bench-password' };
  const { accessToken: token } = await api('/api/auth/login', null, { method: 'POST', body: JSON.stringify(login) });
  // a move as a driver meets it before departure: the most issued permits (each with its PDF) and a confirmed escort
  const [move] = (await db.query(
    `SELECT m.id, m.reference, (SELECT count(*)::int FROM permits p WHERE p.move_id = m.id AND p.status = 'issued') AS permits,
            (SELECT count(*)::int FROM escort_bookings b WHERE b.move_id = m.id) AS bookings
       FROM moves m
      WHERE m.stage = 'escorts_booked' AND m.reference LIKE 'AM-L-%'
        AND EXISTS (SELECT 1 FROM escort_bookings b WHERE b.move_id = m.id AND b.status = 'confirmed')
      ORDER BY 3 DESC, m.reference LIMIT 1`,
  )).rows;
  const hasPermits = (await db.query(`SELECT to_regclass('public.permits') AS t`)).rows[0].t !== null;
  const routes = [
    { name: 'floor (no work)', path: '/api/health/live' },
    { name: 'moves list (stage filter, page 3)', path: '/api/moves?stage=requested&sort=departure&page=3&pageSize=20', budget: true, list: true },
    { name: 'moves list (search)', path: '/api/moves?search=Harrowgate&sort=-departure&pageSize=20' },
    // the desk opens on the open permits (to file, filed, rejected, needs amendment); "any status" adds the issued history
    ...(hasPermits ? [
      { name: 'permit queue (open, the desk default)', path: '/api/permits?status=open&sort=urgency&page=2&pageSize=20', budget: true },
      { name: 'permit queue (any status)', path: '/api/permits?sort=urgency&page=2&pageSize=20' },
    ] : []),
    { name: 'move page', path: `/api/moves/${move.id}`, budget: true },
    { name: 'assessment', path: `/api/moves/${move.id}/assessment` },
    { name: 'run sheet', path: `/api/moves/${move.id}/run-sheet`, budget: true },
    { name: 'login', path: '/api/auth/login', method: 'POST', body: JSON.stringify(login), noAuth: true },
  ];
  const results = [];
  for (const r of routes) {
    const row = { name: r.name, byConn: {} };
    // SQL statements per request, from pg_stat_statements over 20 sequential requests, measured before the load
    // (requests still queued after a load run would otherwise be counted too)
    await db.query('SELECT pg_stat_statements_reset()');
    for (let i = 0; i < 20; i++) {
      await fetch(BASE + r.path, { method: r.method || 'GET', body: r.body, headers: { 'content-type': 'application/json', ...(r.noAuth ? {} : { authorization: `Bearer ${token}` }) } }).then((x) => x.text());
    }
    const [{ calls }] = (await db.query(`SELECT coalesce(sum(calls), 0)::int AS calls FROM pg_stat_statements WHERE query NOT ILIKE '%pg_stat_statements%' AND dbid = (SELECT oid FROM pg_database WHERE datname = current_database())`)).rows;
    row.queries = calls / 20;
    for (const c of CONNECTIONS) {
      const out = await cannon({
        url: BASE + r.path, connections: c, method: r.method || 'GET', body: r.body,
        headers: { 'content-type': 'application/json', ...(r.noAuth ? {} : { authorization: `Bearer ${token}` }) },
      });
      await new Promise((res) => setTimeout(res, 1500)); // let queued requests drain before the next cell
      row.byConn[c] = { rps: out.requests.average, p50: out.latency.p50, p95: out.latency.p97_5 !== undefined ? percentile(out, 95) : out.latency.p90, p99: out.latency.p99, errors: out.errors + out.non2xx + out.timeouts };
    }
    results.push({ ...r, ...row });
    console.log(`${r.name}: ${CONNECTIONS.map((c) => `${c} conn ${Math.round(row.byConn[c].rps)} req/s p95 ${row.byConn[c].p95} ms`).join(' | ')} | ${row.queries} SQL/request`);
  }
  const floor = results[0];
  const budgets = [];
  for (const r of results.filter((x) => x.budget)) {
    const at10 = r.byConn[10];
    budgets.push([`${r.name}: p95 ≤ 50 ms at 10 connections`, at10.p95 <= 50, `${at10.p95} ms`]);
    budgets.push([`${r.name}: p95 ≤ 5× the floor at 10 connections`, at10.p95 <= 5 * Math.max(floor.byConn[10].p95, 1), `${at10.p95} ms vs floor ${floor.byConn[10].p95} ms`]);
  }
  const list = results.find((x) => x.list);
  budgets.push(['moves list ≥ 300 requests/s at 50 connections', list.byConn[50].rps >= 300, `${Math.round(list.byConn[50].rps)} req/s`]);
  const errors = results.reduce((s, r) => s + CONNECTIONS.reduce((a, c) => a + r.byConn[c].errors, 0), 0);
  budgets.push(['no errors', errors === 0, `${errors} errors`]);

  // front end: gzipped initial JS/CSS of the sign-in page and of each lazy route
  const dist = join(ROOT, 'frontend', 'dist');
  const manifest = JSON.parse(readFileSync(join(dist, '.vite', 'manifest.json'), 'utf8'));
  const gz = (f) => zlib.gzipSync(readFileSync(join(dist, f))).length;
  const closure = (key, seen = new Set()) => {
    if (seen.has(key)) return seen;
    seen.add(key);
    for (const i of manifest[key].imports || []) closure(i, seen);
    return seen;
  };
  const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
  const initial = closure(entryKey);
  const signInKey = Object.keys(manifest).find((k) => k.endsWith('routes/sign-in.tsx'));
  const signIn = closure(signInKey, new Set(initial));
  const size = (keys) => {
    let js = 0; let css = 0;
    for (const k of keys) { js += gz(manifest[k].file); for (const c of manifest[k].css || []) css += gz(c); }
    return { js, css };
  };
  const signInSize = size(signIn);
  const routeSizes = Object.keys(manifest).filter((k) => /src\/app\/routes\//.test(k)).map((k) => {
    const own = [...closure(k)].filter((x) => !initial.has(x));
    return { route: k.replace(/^.*src\/app\/routes\//, ''), ...size(own) };
  });
  budgets.push(['sign-in page initial JS ≤ 250 kB gzip', signInSize.js <= 250_000, `${(signInSize.js / 1000).toFixed(1)} kB`]);

  // first render of the moves list in headless Chromium, with the large dataset
  let firstRender = null;
  try {
    const { chromium } = require('playwright-core');
    const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'] });
    const page = await browser.newPage();
    await page.goto(BASE + '/sign-in');
    await page.evaluate((t) => localStorage.setItem('amberline.token', t), token);
    const times = [];
    for (let i = 0; i < 3; i++) {
      await page.goto(BASE + '/moves');
      await page.locator('.ant-table-row').first().waitFor({ timeout: 15000 });
      times.push(await page.evaluate(() => performance.now()));
    }
    firstRender = times.sort((a, b) => a - b)[1];
    await browser.close();
  } catch (e) {
    console.log(`first render not measured: ${e.message.split('\n')[0]}`);
  }
  budgets.push(['moves list first render ≤ 1.5 s', firstRender !== null && firstRender <= 1500, firstRender === null ? 'not measured' : `${Math.round(firstRender)} ms`]);

  // engine: one full plan check
  const engineOut = execFileSync('npm', ['run', '-s', 'bench', '-w', 'common'], { cwd: ROOT }).toString();
  const m = /p50 ([\d.]+) ms, p95 ([\d.]+) ms/.exec(engineOut);
  const p50 = m ? Number(m[1]) : NaN;
  budgets.push(['engine full plan check p50 ≤ 2 ms', p50 <= 2, `${p50} ms`]);

  const counts = (await db.query(`SELECT (SELECT count(*) FROM moves)::int AS moves, (SELECT count(*) FROM users)::int AS users,
    ${hasPermits ? '(SELECT count(*) FROM permits)::int' : '0'} AS permits, ${hasPermits ? '(SELECT count(*) FROM permit_documents)::int' : '0'} AS documents,
    (CASE WHEN to_regclass('public.escort_bookings') IS NULL THEN 0 ELSE (SELECT count(*) FROM escort_bookings)::int END) AS bookings`)).rows[0];
  await db.end();

  const lines = [];
  lines.push('# Benchmark results', '');
  lines.push(`Run ${new Date().toISOString()} on ${os.cpus().length} × ${os.cpus()[0].model}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}, PostgreSQL on loopback; ${DURATION} s per cell (autocannon).`);
  lines.push(`Dataset: ${counts.moves} moves, ${counts.permits} permits (${counts.documents} permit PDFs), ${counts.bookings} escort bookings, ${counts.users} users; seeded in ${(Number(process.env.SEED_MS || 0) / 1000).toFixed(1)} s.`);
  lines.push(`Move page, assessment and run sheet: ${move.reference}, escorts booked, ${move.permits} issued permits with PDFs, ${move.bookings} escort booking(s).`, '');
  lines.push('| route | conns | req/s | p50 ms | p95 ms | p99 ms | errors | × floor p95 | SQL/req |', '| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |');
  for (const r of results) for (const c of CONNECTIONS) {
    const x = r.byConn[c];
    lines.push(`| ${r.name} | ${c} | ${Math.round(x.rps)} | ${x.p50} | ${x.p95} | ${x.p99} | ${x.errors} | ${(x.p95 / Math.max(floor.byConn[c].p95, 1)).toFixed(1)} | ${c === 1 ? r.queries : ''} |`);
  }
  lines.push('', '| front end (gzip) | JS kB | CSS kB |', '| --- | ---: | ---: |', `| sign-in page, initial | ${(signInSize.js / 1000).toFixed(1)} | ${(signInSize.css / 1000).toFixed(1)} |`);
  for (const r of routeSizes) lines.push(`| route ${r.route} (lazy, beyond initial) | ${(r.js / 1000).toFixed(1)} | ${(r.css / 1000).toFixed(1)} |`);
  lines.push('', `Moves list first render in headless Chromium: ${firstRender === null ? 'not measured' : `${Math.round(firstRender)} ms`}. Engine plan check: ${engineOut.trim().split('\n').pop()}`);
  lines.push('', '| budget | result | measured |', '| --- | --- | --- |');
  for (const [name, ok, measured] of budgets) lines.push(`| ${name} | ${ok ? 'PASS' : 'FAIL'} | ${measured} |`);
  writeFileSync(join(__dirname, 'results.md'), lines.join('\n') + '\n');
  console.log('');
  for (const [name, ok, measured] of budgets) console.log(`${ok ? 'PASS' : 'FAIL'}  ${name}  (${measured})`);
  console.log(`\nwritten to backend/scripts/bench/results.md`);
}

function percentile(out, p) {
  // autocannon reports p90, p97_5 and p99; p95 lies between: interpolate
  const a = out.latency.p90, b = out.latency.p97_5;
  return Math.round((a + ((b - a) * (95 - 90)) / (97.5 - 90)) * 100) / 100;
}

main().catch((e) => { console.error(e); process.exit(1); });
