import { afterAll, describe, expect, it } from 'vitest';
import { createHarness, signUpShop, uniqueEmail } from '../test/harness';
import { startSmtpFake } from './smtpFake';

const h = createHarness();
afterAll(() => h.database.close());

describe('mail without any settings', () => {
  it('the app built with no mailer sends to an in-process fake and keeps the message in the outbox', async () => {
    const { agent } = await signUpShop(h);
    const email = uniqueEmail('default-mailer');
    expect((await agent.post('/api/members/invitations').send({ email, role: 'front_desk' })).status).toBe(201);
    const [item] = (await agent.get('/api/outbox')).body.messages;
    expect(item).toMatchObject({ toAddress: email, purpose: 'invitation', error: null });
    const message = (await agent.get(`/api/outbox/${item.id}`)).body.message;
    expect(message.messageId).toMatch(/^<.+@.+>$/);
  });
});

describe('the SMTP fake', () => {
  it('waitFor gives up with a clear error when no message comes', async () => {
    const fake = await startSmtpFake();
    try {
      await expect(fake.waitFor('nobody@tests.example', 50)).rejects.toThrow('no message to nobody@tests.example within 50 ms');
    } finally {
      await fake.close();
    }
  });
});
