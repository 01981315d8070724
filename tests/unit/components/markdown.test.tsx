// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { Markdown, safeUrl } from '../../../src/components/markdown';

afterEach(cleanup);

describe('Markdown', () => {
  it('when a write-up has a GFM table and a task list, then both render', () => {
    render(<Markdown>{'| Bolt | N·m |\n| --- | --- |\n| Caliper | 85 |\n\n- [x] bled\n- [ ] bedded in'}</Markdown>);
    expect(screen.getByRole('table')).toBeTruthy();
    expect(screen.getByRole('cell', { name: '85' })).toBeTruthy();
    expect(screen.getAllByRole('checkbox')).toHaveLength(2);
  });

  it('when a write-up carries raw HTML, then none of it becomes an element', () => {
    const { container } = render(
      <Markdown>{'Before <script>window.x=1</script> <img src=x onerror="alert(1)"> <b>bold</b> after'}</Markdown>,
    );
    expect(container.querySelector('script, img, b')).toBeNull();
    expect(container.textContent).toContain('Before');
  });

  it('when links use other schemes than http(s) or mailto, then they lose their address', () => {
    render(
      <Markdown>
        {'[a](javascript:alert(1)) [b](data:text/html,x) [c](https://example.com/x) [d](mailto:kai@example.com) [e](/swaps/h31)'}
      </Markdown>,
    );
    expect(screen.getByText('a').closest('a')).toBeNull();
    expect(screen.getByText('b').closest('a')).toBeNull();
    expect(screen.getByText('c').closest('a')?.getAttribute('href')).toBe('https://example.com/x');
    expect(screen.getByText('d').closest('a')?.getAttribute('href')).toBe('mailto:kai@example.com');
    expect(screen.getByText('e').closest('a')?.getAttribute('href')).toBe('/swaps/h31');
  });

  it('when safeUrl sees mixed-case or encoded schemes, then it refuses them', () => {
    expect(safeUrl('JaVaScRiPt:alert(1)')).toBe('');
    expect(safeUrl('vbscript:x')).toBe('');
    expect(safeUrl('https://example.com')).toBe('https://example.com');
  });
});

describe('Markdown image and link addresses', () => {
  it('when an image path climbs out of /media/ with dot segments or encodings, then no image is requested', () => {
    const sources = [
      '/media/../l/k7mpq2x',
      '/media/%2e%2e/l/k7mpq2x',
      '/media/./../l/k7mpq2x',
      '/media/..%2fl/k7mpq2x',
      '/media/abcdefghijklmnop/../../l/k7mpq2x',
      '/media\\..\\l\\k7mpq2x',
      '//media/abcdefghijklmnop',
      '/media/abcdefghijklmnop?size=thumb&x=/../l/k7mpq2x',
    ];
    const { container } = render(<Markdown>{sources.map((s, i) => `![p${i}](${s})`).join('\n\n')}</Markdown>);
    expect(container.querySelectorAll('img')).toHaveLength(0);
    for (let i = 0; i < sources.length; i++) expect(container.textContent).toContain(`p${i}`);
  });

  it('when an image is one of our stored photos, then it renders at that exact address', () => {
    const { container } = render(
      <Markdown>{'![caliper](/media/abcdefghijklmnop) ![thumb](/media/abcdefghijklmnop?size=thumb)'}</Markdown>,
    );
    expect([...container.querySelectorAll('img')].map((i) => i.getAttribute('src'))).toEqual([
      '/media/abcdefghijklmnop',
      '/media/abcdefghijklmnop?size=thumb',
    ]);
  });

  it('when a relative link has dot segments or starts with two slashes, then its address is the one it really points to', () => {
    render(<Markdown>{'[a](/media/../l/k7mpq2x) [b](//elsewhere.example/x) [c](/\\elsewhere.example/y)'}</Markdown>);
    expect(screen.getByText('a').closest('a')?.getAttribute('href')).toBe('/l/k7mpq2x');
    const b = screen.getByText('b').closest('a')!;
    expect(b.getAttribute('href')).toBe('https://elsewhere.example/x');
    expect(b.getAttribute('target')).toBe('_blank');
    // the markdown parser percent-encodes the backslash, so this one stays a path on our own site
    expect(new URL(screen.getByText('c').closest('a')!.getAttribute('href')!, 'https://swapyard.invalid').origin).toBe(
      'https://swapyard.invalid',
    );
    expect(safeUrl('/\\elsewhere.example/y')).toBe('https://elsewhere.example/y');
  });
});

describe('Markdown that nests too deeply', () => {
  it('when a text holds 39,000 quote markers, then it is shown as written with a note and never parsed', () => {
    const text = `Before\n${'>'.repeat(39_000)} x`;
    const { container } = render(<Markdown>{text}</Markdown>);
    expect(container.querySelector('blockquote')).toBeNull();
    expect(screen.getByRole('note').textContent).toMatch(/nest too deeply to format/);
    expect(container.textContent).toContain('Before');
  });

  it('when a text nests lists a few levels, then it is formatted as usual', () => {
    const { container } = render(<Markdown>{'- a\n  - b\n    - c'}</Markdown>);
    expect(container.querySelectorAll('ul')).toHaveLength(3);
    expect(screen.queryByRole('note')).toBeNull();
  });
});
