import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../../server/config';
import {
  classInviteMail,
  feedbackMail,
  passwordResetMail,
  shareNoticeMail,
} from '../../../server/services/mail/messages';
import { Html, markup } from '../../../server/services/mail/html';

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

  it('escapes what is put into markup, and only that', () => {
    const link = markup`<a href="${'https://x.example.test/?a=1&b="2"'}">${"O'Neil <i>"}</a>`;
    expect(link.value).toBe('<a href="https://x.example.test/?a=1&amp;b=&quot;2&quot;">O&#39;Neil &lt;i&gt;</a>');
    // Markup put into markup stays markup.
    expect(markup`<p>${link} ${3}</p>`.value).toBe(`<p>${link.value} 3</p>`);
    expect(link).toBeInstanceOf(Html);
  });

  it('keeps typed text as it is in the text body and escaped in the HTML one', () => {
    const invite = classInviteMail(config, {
      to: 'c@example.test',
      instructor: 'Dr <Lee>',
      className: 'Chassis & "Steering"',
      token: 'tk',
      expiresAt: new Date('2027-03-01T12:00:00Z'),
    });
    expect(invite.text).toContain('Dr <Lee> invites you to join the class "Chassis & "Steering"" in Arcwright.');
    expect(invite.text).toContain('The link works once, until 2027-03-01.');
    expect(invite.html).toContain(
      'Dr &lt;Lee&gt; invites you to join the class <strong>Chassis &amp; &quot;Steering&quot;</strong>',
    );
    expect(invite.html).not.toContain('<Lee>');

    const feedback = feedbackMail(config, {
      to: { email: 'd@example.test', name: 'Sam' },
      instructor: 'Dr Lee',
      assignmentId: 4,
      title: 'Lab <1>',
      text: 'Good roll centre.\r\nNow the <anti-dive>.',
    });
    // The text body: greeting, paragraphs, link and footer apart by blank lines, the feedback as typed.
    expect(feedback.text).toBe(
      [
        'Hello Sam,',
        '',
        'Dr Lee wrote feedback on your hand-in for "Lab <1>":',
        '',
        'Good roll centre.\r\nNow the <anti-dive>.',
        '',
        'https://arcwright.example.test/assignments/4',
        '',
        'You get this mail because you handed in work for "Lab <1>" in Arcwright.',
      ].join('\n'),
    );
    expect(feedback.html).toContain('<p>Good roll centre.<br>Now the &lt;anti-dive&gt;.</p>');
    expect(feedback.html).toContain('href="https://arcwright.example.test/assignments/4"');
  });
});
