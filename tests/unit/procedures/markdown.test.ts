import { describe, expect, it } from 'vitest';
import { instructionsToHtml } from '../../../src/lib/procedures/markdown';

describe('step instructions', () => {
  it('renders light Markdown', () => {
    expect(instructionsToHtml('Let it **cool** first.\n\n- drain\n- wipe')).toBe(
      '<p>Let it <strong>cool</strong> first.</p>\n<ul>\n<li>drain</li>\n<li>wipe</li>\n</ul>\n',
    );
  });

  it('never passes raw HTML through', () => {
    const html = instructionsToHtml('<script>alert(1)</script> <img src=x onerror=alert(1)>');
    expect(html).not.toContain('<script');
    expect(html).not.toContain('<img');
    expect(html).toContain('&lt;script&gt;');
  });

  it('refuses script addresses in links and keeps others safe to open', () => {
    expect(instructionsToHtml('[x](javascript:alert(1))')).not.toContain('href="javascript');
    expect(instructionsToHtml('[x](data:text/html,hi)')).not.toContain('href="data');
    expect(instructionsToHtml('[sheet](https://example.test/a)')).toContain(
      '<a href="https://example.test/a" rel="noopener noreferrer" target="_blank">sheet</a>',
    );
  });
});
