import MarkdownIt from 'markdown-it'
import { labelOfApiWord } from '#shared/utils/vocabulary'

// HTML in sources is escaped (html: false) and markdown-it refuses javascript:/data: links, so
// rendered procedures cannot inject markup.
const md = new MarkdownIt({ html: false, linkify: false, typographer: false })

// Procedures quote API words in code spans (`compressorCurrent`); a technician reads their labels.
const codeInline = md.renderer.rules.code_inline!
md.renderer.rules.code_inline = (tokens, idx, options, env, self) => {
  const label = labelOfApiWord(tokens[idx]!.content)
  return label ? `<em>${md.utils.escapeHtml(label)}</em>` : codeInline(tokens, idx, options, env, self)
}

/** Renders knowledge-base Markdown to safe HTML, with quoted API words shown as their labels. */
export function renderMarkdown(source: string): string {
  return md.render(source)
}
