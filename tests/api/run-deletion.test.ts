import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ApiClient } from '../helpers/api-client';
import { startServer, type RunningServer, openDatabase } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let carId: string;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Mistaken Runs');
  carId = (await team.chief.post('/api/cars', { name: 'Slip car' })).body.id;
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

let minute = 0;
async function logRun(client: ApiClient): Promise<string> {
  minute += 1;
  const answer = await client.post('/api/runs', {
    carId,
    at: new Date(Date.UTC(2026, 4, 2, 10, minute)).toISOString(),
  });
  expect(answer.status).toBe(201);
  return answer.body.id;
}

async function sql(statement: string, args: string[] = []) {
  const db = await openDatabase(server.databaseUrl);
  try {
    return (await db.execute({ sql: statement, args })).rows;
  } finally {
    db.close();
  }
}

describe('taking back a run logged by mistake', () => {
  it('lets a technician delete a run they logged in the last 24 hours, with an audit row', async () => {
    const runId = await logRun(team.tech);
    expect((await team.tech.delete(`/api/runs/${runId}`)).status).toBe(204);
    expect((await team.tech.get(`/api/runs/${runId}`)).status).toBe(404);
    const audit = await sql("SELECT action FROM audit_events WHERE record_type = 'run' AND record_id = ?", [runId]);
    expect(audit.map((row) => row.action)).toContain('delete');
  });

  it("refuses a technician another person's run, and their own once a day has passed since logging it", async () => {
    const chiefs = await logRun(team.chief);
    const refused = await team.tech.delete(`/api/runs/${chiefs}`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/24 hours/);

    const old = await logRun(team.tech);
    const dayAndAMinuteAgo = Date.now() - (24 * 60 + 1) * 60_000;
    await sql('UPDATE runs SET created_at = ? WHERE id = ?', [String(dayAndAMinuteAgo), old]);
    expect((await team.tech.delete(`/api/runs/${old}`)).status).toBe(403);
    // Both runs are still there.
    expect((await team.tech.get(`/api/runs/${chiefs}`)).status).toBe(200);
    expect((await team.tech.get(`/api/runs/${old}`)).status).toBe(200);
    // A crew chief may still delete it.
    expect((await team.chief.delete(`/api/runs/${old}`)).status).toBe(204);
  });

  it('never lets a viewer delete a run', async () => {
    const runId = await logRun(team.tech);
    expect((await team.viewer.delete(`/api/runs/${runId}`)).status).toBe(403);
    expect((await team.tech.get(`/api/runs/${runId}`)).status).toBe(200);
  });
});
