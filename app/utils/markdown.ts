import MarkdownIt from 'markdown-it'

// HTML in sources is escaped (html: false) and markdown-it refuses javascript:/data: links, so
// rendered procedures cannot inject markup.
const md = new MarkdownIt({ html: false, linkify: false, typographer: false })

/** Renders knowledge-base Markdown to safe HTML. */
export function renderMarkdown(source: string): string {
  return md.render(source)
}
