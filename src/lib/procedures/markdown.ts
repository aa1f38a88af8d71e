import MarkdownIt from 'markdown-it';

/**
 * Step instructions: light Markdown (emphasis, lists, links, code) rendered by markdown-it with raw
 * HTML off, so a `<script>` or `<img onerror>` typed into a step is shown as text, and its link check
 * refuses javascript:, vbscript:, file: and data: addresses. Rendered on the server only; islands get
 * the HTML, not the library.
 */
const renderer = new MarkdownIt({ html: false, linkify: false, breaks: true, typographer: false });

// Links open outside the checklist, without handing it the opener or the referrer.
const defaultLinkOpen =
  renderer.renderer.rules.link_open ?? ((tokens, idx, options, _env, self) => self.renderToken(tokens, idx, options));
renderer.renderer.rules.link_open = (tokens, idx, options, env, self) => {
  tokens[idx]!.attrSet('rel', 'noopener noreferrer');
  tokens[idx]!.attrSet('target', '_blank');
  return defaultLinkOpen(tokens, idx, options, env, self);
};

/**
 * The HTML of a step's instructions (safe to insert: markdown-it escapes every tag it is given).
 * @example instructionsToHtml('Let it **cool**') // '<p>Let it <strong>cool</strong></p>\n'
 */
export function instructionsToHtml(markdown: string | undefined): string {
  return markdown ? renderer.render(markdown) : '';
}
