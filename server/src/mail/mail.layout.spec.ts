import { CAUTION_TEXT } from '@plummet/shared';
import { describe, expect, it } from 'vitest';
import { renderMail } from './mail.layout.js';

describe('renderMail', () => {
  const content = {
    subject: 'S',
    paragraphs: ['Hello <Dev> & co'],
    action: { label: 'Open', url: 'https://plummet.example.test/accept-invite?token=abc&x="1"' },
  };

  it('ends the text and the HTML with the safety caution', () => {
    const { text, html } = renderMail(content);
    expect(text.trimEnd().endsWith(CAUTION_TEXT)).toBe(true);
    expect(html).toContain(CAUTION_TEXT);
    expect(html.indexOf(CAUTION_TEXT)).toBeGreaterThan(html.indexOf('Open'));
  });

  it('escapes names and links in the HTML and keeps the bare link in the text', () => {
    const { text, html } = renderMail(content);
    expect(html).toContain('Hello &lt;Dev&gt; &amp; co');
    expect(html).toContain('href="https://plummet.example.test/accept-invite?token=abc&amp;x=&quot;1&quot;"');
    expect(text).toContain('Open: https://plummet.example.test/accept-invite?token=abc&x="1"');
  });
});
