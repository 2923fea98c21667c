import type { INestApplication } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { Test, type TestingModuleBuilder } from '@nestjs/testing';
import { DataSource } from 'typeorm';
import type { Role } from '@amberline/common';
import { seedUser, type SeededUser, type SeedUserInput } from '@amberline/seed';
import request from 'supertest';
import { AppModule } from '../../src/app.module';
import { configureApp } from '../../src/configure-app';

export type TestApp = {
  app: INestApplication;
  ds: DataSource;
  http: () => ReturnType<typeof request>;
  /** A user of the given role with a fresh token. */
  signedIn: (input?: SeedUserInput) => Promise<SeededUser & { token: string }>;
  /** One fresh signed-in user per role, by role. */
  signedInAll: () => Promise<Record<Role, SeededUser & { token: string }>>;
  close: () => Promise<void>;
};

// each test file starts at its own point, so files run one after another in a worker never share an address
let ipCounter = 1 + Math.floor(Math.random() * 60_000);
/** A distinct client address per call (through X-Forwarded-For), so sign-in limits of one test do not touch another. */
export const nextIp = () => `10.${process.pid % 250}.${Math.floor(ipCounter / 250) % 250}.${ipCounter++ % 250}`;

/** Boots the real AppModule against the test database, with the same settings as the server. `override` may
 * replace providers (e.g. the mail settings of one test file). */
export async function createTestApp(override: (b: TestingModuleBuilder) => TestingModuleBuilder = (b) => b): Promise<TestApp> {
  const moduleRef = await override(Test.createTestingModule({ imports: [AppModule] })).compile();
  const app = moduleRef.createNestApplication({ rawBody: true, logger: ['error', 'warn'] });
  configureApp(app);
  // the tests stand behind a proxy on loopback: each test gives its own client address in X-Forwarded-For
  app.getHttpAdapter().getInstance().set('trust proxy', 'loopback');
  await app.init();
  return testAppOf(app);
}

/**
 * Boots the app as the server does (NestFactory, as in main.ts): with the built front end served next to the API,
 * as under `npm start`. (A testing module's providers are made before the HTTP adapter exists, so createTestApp's
 * app never serves the front end.)
 */
export async function createServedTestApp(): Promise<TestApp> {
  const app = await NestFactory.create(AppModule, { rawBody: true, logger: ['error', 'warn'] });
  configureApp(app);
  // behind a proxy on loopback, as createTestApp's app: each test gives its own client address in X-Forwarded-For
  app.getHttpAdapter().getInstance().set('trust proxy', 'loopback');
  await app.init();
  return testAppOf(app);
}

function testAppOf(app: INestApplication): TestApp {
  const ds = app.get(DataSource);
  const http = () => request(app.getHttpServer());
  const signedIn = async (input: SeedUserInput = {}) => {
    const user = await seedUser(ds, input);
    const res = await http().post('/api/auth/login').set('x-forwarded-for', nextIp()).send({ email: user.email, password: user.password });
    if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
    return { ...user, token: res.body.accessToken as string };
  };
  const signedInAll = async () => {
    const out = {} as Record<Role, SeededUser & { token: string }>;
    for (const role of ['admin', 'dispatcher', 'permit_clerk', 'driver'] as Role[]) out[role] = await signedIn({ role });
    return out;
  };
  return { app, ds, http, signedIn, signedInAll, close: () => app.close() };
}
