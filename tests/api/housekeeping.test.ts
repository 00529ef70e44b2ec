import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { newMember, startTestServer, type Caller, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { tinyPng } from './fixtures/images';
import { MailQueueItem, Sketch, Upload, UploadChunk } from '../../server/models';
import { runHousekeeping } from '../../server/services/housekeeping';
import { databaseRateCounter } from '../../server/database';

// Every instance runs the housekeeping on its own timer: two runs at the same moment must each succeed and
// together delete each expired row once, and nothing else.
let server: TestServer;
let owner: Caller;
beforeAll(async () => {
  server = await startTestServer();
  owner = await newMember(server.app, 'keeper');
});
afterAll(async () => {
  await server.close();
});

const DAY_MS = 24 * 3600_000;

async function sketchWithPhoto(name: string): Promise<{ id: number; upload: string }> {
  const id = (
    await owner
      .post('/api/sketches')
      .send({ name, document: sketchFile(name) })
      .expect(201)
  ).body.id;
  const up = await owner.post(`/api/sketches/${id}/uploads`).attach('file', tinyPng(), 'photo.png').expect(201);
  return { id, upload: up.body.id };
}

describe('housekeeping run by several instances at once', () => {
  it('deletes binned sketches past the restore window, ended rate counts and old finished mail once; keeps the rest', async () => {
    const binned = await Promise.all([sketchWithPhoto('Binned 1'), sketchWithPhoto('Binned 2')]);
    const kept = await sketchWithPhoto('Kept');
    for (const s of binned) await owner.delete(`/api/sketches/${s.id}`).expect(204);
    await Sketch.update({ deletedAt: new Date(Date.now() - 31 * DAY_MS) }, { where: { id: binned.map((s) => s.id) } });

    const counter = databaseRateCounter(server.sequelize, { keyPrefix: 'housekeeping-test', points: 5, durationS: 1 });
    await counter.penalty('ended', 1);
    const live = databaseRateCounter(server.sequelize, { keyPrefix: 'housekeeping-live', points: 5, durationS: 3600 });
    await live.penalty('running', 2);

    const old = new Date(Date.now() - 40 * DAY_MS);
    const finished = await MailQueueItem.create({
      to: 'old@example.test',
      subject: 'old',
      text: '',
      html: '',
      state: 'sent',
      nextAttemptAt: old,
    });
    await server.sequelize.getQueryInterface().bulkUpdate('mail_queue', { updatedAt: old }, { id: finished.id });
    const waiting = await MailQueueItem.create({
      to: 'later@example.test',
      subject: 'waiting',
      text: 't',
      html: 't',
      state: 'queued',
      nextAttemptAt: new Date(Date.now() + DAY_MS),
    });

    await new Promise((resolve) => setTimeout(resolve, 1100)); // the 1 s window of 'ended' is over
    await Promise.all([runHousekeeping(), runHousekeeping()]);

    expect(await Sketch.count({ where: { id: binned.map((s) => s.id) } })).toBe(0);
    expect(await Upload.count({ where: { id: binned.map((s) => s.upload) } })).toBe(0);
    expect(await UploadChunk.count({ where: { uploadId: { [Op.in]: binned.map((s) => s.upload) } } })).toBe(0);
    expect(await Sketch.findByPk(kept.id)).not.toBeNull();
    expect(await Upload.findByPk(kept.upload)).not.toBeNull();
    expect(await counter.get('ended')).toBeNull();
    expect((await live.get('running'))?.consumedPoints).toBe(2);
    expect(await MailQueueItem.findByPk(finished.id)).toBeNull();
    expect(await MailQueueItem.findByPk(waiting.id)).not.toBeNull();
    // Not for sending in this test (closing the app waits for the queue to empty).
    await waiting.destroy();
  });
});
