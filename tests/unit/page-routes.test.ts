import { describe, expect, it } from 'vitest';
import { matchPage, pageRoutes } from '../../shared/page-routes';
import { paths } from '../../src/config/paths';

describe('the page table', () => {
  it('when the app builds a link to a page, then the table knows that page by the same name', () => {
    const links: [string, string][] = [
      ['home', paths.home()],
      ['search', paths.search('q=vela')],
      ['swap', paths.swap('h31-front-vela')],
      ['swapRevision', paths.swapRevision('h31-front-vela', 2)],
      ['swapCompare', paths.swapCompare('h31-front-vela', 1, 2)],
      ['chassis', paths.chassis('halden-h31')],
      ['part', paths.part(7)],
      ['whereElse', paths.whereElse('NGF-1')],
      ['openData', paths.openData()],
      ['apiDocs', paths.apiDocs()],
      ['tools', paths.tools()],
      ['submit', paths.submit()],
      ['editSubmission', paths.editSubmission(3)],
      ['mySubmissions', paths.mySubmissions()],
      ['myCars', paths.myCars()],
      ['review', paths.review()],
      ['reviewRevision', paths.reviewRevision(9)],
      ['reportModeration', paths.reportModeration()],
      ['shop', paths.shop('ridgeway-performance')],
      ['shopLinks', paths.shopLinks()],
      ['outbox', paths.outbox()],
      ['admin', paths.admin()],
      ['signIn', paths.signIn('/submit')],
    ];
    for (const [name, href] of links) expect(matchPage(new URL(href, 'http://x').pathname)?.name, href).toBe(name);
  });

  it('when an address is not a page, then nothing matches', () => {
    for (const p of ['/swaps', '/swaps/a/b', '/me', '/review/1/extra', '/api/swaps/x', '/l/k7mpq2x', '/media/abc'])
      expect(matchPage(p), p).toBeNull();
    expect(matchPage('/swaps/h31-front-vela/r/2')).toEqual({ name: 'swapRevision', params: { slug: 'h31-front-vela', n: '2' } });
    expect(Object.keys(pageRoutes)).toContain('signInFailed');
  });
});
