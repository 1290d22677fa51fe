import request from 'supertest';
import type { Express } from 'express';
import { DEMO_PASSWORD } from '@/server/seeders/demo';

/** A supertest agent that keeps cookies, signed in as `email`. */
export async function signedInAgent(app: Express, email: string) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

export const DEMO = {
  admin: 'admin@demo.kenning.test',
  planner: 'planner@demo.kenning.test',
  reviewer: 'reviewer@demo.kenning.test',
  observer: 'observer@demo.kenning.test',
  otherAdmin: 'admin@tallon.kenning.test',
  otherPlanner: 'planner@tallon.kenning.test',
  otherReviewer: 'reviewer@tallon.kenning.test',
} as const;
