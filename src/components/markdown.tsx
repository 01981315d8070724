import { Component, createContext, useContext, useEffect, useState, type ReactNode } from 'react';
import ReactMarkdown, { defaultUrlTransform } from 'react-markdown';
import remarkGfm from 'remark-gfm';
import { photoIdPattern } from '@shared/schemas/params';
import { MAX_MARKDOWN_DEPTH, markdownNesting } from '@shared/markdown-nesting';
import { parsesWithin } from './markdown-budget';

const allowedSchemes = /^(https?:|mailto:)/i;
// only a stand-in origin to resolve relative addresses against; never requested
const base = 'https://swapyard.invalid';

/**
 * Only http(s) and mailto links survive; everything else becomes inert. A relative address is resolved
 * the way a browser will resolve it (dot segments, backslashes, `//host`), so what is checked and shown
 * is where it really goes: `/media/../l/x` becomes `/l/x`, `//host/x` becomes `https://host/x`.
 */
export function safeUrl(url: string): string {
  const cleaned = defaultUrlTransform(url);
  if (!cleaned) return '';
  if (/^[a-z][a-z0-9+.-]*:/i.test(cleaned)) return allowedSchemes.test(cleaned) ? cleaned : '';
  if (cleaned.startsWith('#') || cleaned.startsWith('?')) return cleaned;
  let resolved: URL;
  try {
    resolved = new URL(cleaned, `${base}/`);
  } catch {
    return '';
  }
  if (resolved.origin !== base) return resolved.protocol === 'https:' || resolved.protocol === 'http:' ? resolved.href : '';
  return resolved.pathname + resolved.search + resolved.hash;
}

const mediaSrc = /^\/media\/([^/?#]+)(?:\?size=(?:thumb|full))?$/;

/**
 * Images load without a click, so they are limited to our own stored photos, written exactly
 * (`/media/<id>`, optionally `?size=thumb`): nothing a browser would normalise to another address.
 */
export function mediaImageSrc(src: unknown): string | null {
  if (typeof src !== 'string') return null;
  const m = mediaSrc.exec(src);
  return m && photoIdPattern.test(m[1]) ? src : null;
}

/** The words inside a rendered element, for telling a caution from a quotation. */
function textOf(node: unknown): string {
  if (!node || typeof node !== 'object') return '';
  const n = node as { type?: string; value?: string; children?: unknown[] };
  if (n.type === 'text') return n.value ?? '';
  return (n.children ?? []).map(textOf).join('');
}

const proseClass = 'prose prose-neutral max-w-none prose-headings:text-ink prose-a:text-ink prose-table:text-sm';

/** The text as written, when formatting it could hang or crash the page. */
function PlainText({ text, reason, className }: { text: string; reason: string; className: string }) {
  return (
    <div className={className} data-markdown="plain">
      <p role="note" className="mb-2 text-xs font-bold text-graphite-soft">
        Shown as written: {reason}
      </p>
      <div className="whitespace-pre-wrap break-words text-graphite">{text}</div>
    </div>
  );
}

/** A renderer that throws (a stack overflow on some input nobody foresaw) takes only its own text down. */
class MarkdownBoundary extends Component<{ text: string; className: string; children: ReactNode }, { failed: boolean }> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  render() {
    return this.state.failed ? (
      <PlainText text={this.props.text} reason="this text could not be formatted." className={this.props.className} />
    ) : (
      this.props.children
    );
  }
}

// Text nobody has reviewed yet (the review desk's preview) is parsed in a worker against a time budget
// before it is formatted here: some inputs take the parser seconds or minutes, and the desk must stay usable.
const UntrustedText = createContext<number | null>(null);

/** Markdown inside is checked off the page's thread within `budgetMs` before it is formatted. */
export function UntrustedMarkdown({ budgetMs = 1500, children }: { budgetMs?: number; children: ReactNode }) {
  return <UntrustedText.Provider value={budgetMs}>{children}</UntrustedText.Provider>;
}

function useParseVerdict(text: string, budgetMs: number | null): 'ok' | 'checking' | 'too_slow' {
  const [verdict, setVerdict] = useState<{ text: string; ok: boolean } | null>(null);
  useEffect(() => {
    if (budgetMs === null) return;
    let live = true;
    void parsesWithin(text, budgetMs).then((ok) => live && setVerdict({ text, ok }));
    return () => {
      live = false;
    };
  }, [text, budgetMs]);
  if (budgetMs === null) return 'ok';
  if (verdict?.text !== text) return 'checking';
  return verdict.ok ? 'ok' : 'too_slow';
}

/**
 * The one markdown renderer: the sheet, the form preview, shop notes. GFM tables and task lists;
 * raw HTML is never rendered (react-markdown ignores it without rehype-raw). Text nested deeper than
 * the validation allows (stored before the rule, or typed into a preview) is shown as written without
 * being parsed, and a renderer failure shows the text instead of taking the page down.
 */
export function Markdown({ children, className = '' }: { children: string; className?: string }) {
  const classes = `${proseClass} ${className}`;
  const budget = useContext(UntrustedText);
  const tooDeep = markdownNesting(children).depth > MAX_MARKDOWN_DEPTH;
  const verdict = useParseVerdict(children, tooDeep ? null : budget);
  if (tooDeep) return <PlainText text={children} reason="its quotes and lists nest too deeply to format." className={classes} />;
  if (verdict === 'checking')
    return (
      <div className={`${classes} whitespace-pre-wrap`} aria-busy="true">
        {children}
      </div>
    );
  if (verdict === 'too_slow')
    return <PlainText text={children} reason="formatting this text takes too long." className={classes} />;
  return (
    <MarkdownBoundary text={children} className={classes}>
      <div className={classes}>
        <ReactMarkdown
          remarkPlugins={[remarkGfm]}
          skipHtml
          urlTransform={safeUrl}
          components={{
            a: ({ href, children: text }) =>
              href ? (
                <a href={href} rel="nofollow noopener noreferrer" target={href.startsWith('/') ? undefined : '_blank'}>
                  {text}
                </a>
              ) : (
                <span>{text}</span>
              ),
            // GFM task lists: a read-only box that says its state, since the item text is not its label
            input: ({ type, checked }) =>
              type === 'checkbox' ? (
                <input type="checkbox" checked={Boolean(checked)} disabled readOnly aria-label={checked ? 'Done' : 'Not done'} />
              ) : null,
            // a write-up's "> **Safety:** …" is a caution, framed like the sheet's own, not set as a quotation
            blockquote: ({ node, children: quoted }) =>
              /^\s*(safety|caution|warning)\b/i.test(textOf(node)) ? (
                <aside
                  role="note"
                  data-caution
                  className="not-prose my-4 rounded-lg border-2 border-oxide bg-oxide-soft px-4 py-2 text-sm text-graphite [&_p]:my-1"
                >
                  {quoted}
                </aside>
              ) : (
                <blockquote>{quoted}</blockquote>
              ),
            img: ({ src, alt }) => {
              const own = mediaImageSrc(src);
              return own ? <img src={own} alt={alt ?? ''} loading="lazy" /> : <span>{alt}</span>;
            },
          }}
        >
          {children}
        </ReactMarkdown>
      </div>
    </MarkdownBoundary>
  );
}
