import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../../server/config';
import { passwordResetMail, shareNoticeMail } from '../../../server/services/mail/messages';

const config = loadConfig({ PUBLIC_URL: 'https://arcwright.example.test' });

describe('mail messages', () => {
  it('builds the reset link from PUBLIC_URL, in text and HTML', () => {
    const m = passwordResetMail(config, { email: 'a@example.test', name: 'Ada' }, 'tok_en-1', 60);
    expect(m.to).toBe('a@example.test');
    expect(m.text).toContain('https://arcwright.example.test/reset?token=tok_en-1');
    expect(m.html).toContain('href="https://arcwright.example.test/reset?token=tok_en-1"');
    expect(m.text).toContain('60 minutes');
  });

  it('escapes names in HTML and keeps the subject on one line', () => {
    const m = shareNoticeMail(config, {
      to: 'b@example.test',
      from: { id: 1, email: 'o@example.test', name: 'Owner <b>', role: 'member' },
      sketchName: 'Rear\r\nBcc: victim@example.test',
      url: 'https://arcwright.example.test/shared/abc',
    });
    expect(m.subject).not.toMatch(/[\r\n]/);
    expect(m.html).toContain('Owner &lt;b&gt;');
    expect(m.html).not.toContain('<b>');
    expect(m.text).toContain('https://arcwright.example.test/shared/abc');
  });
});
