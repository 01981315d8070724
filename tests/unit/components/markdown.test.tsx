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
