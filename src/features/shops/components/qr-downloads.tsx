import { qrUrl } from '../api/shop-links';

/** The link's QR code with PNG and SVG downloads. */
export function QrDownloads({ code, size = 'h-32 w-32' }: { code: string; size?: string }) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <img
        src={qrUrl(code, 'svg')}
        alt={`QR code of the shop link ${code}`}
        className={`${size} rounded border border-ink/10 bg-white p-1`}
      />
      <div className="flex flex-col gap-1 text-sm">
        <a href={qrUrl(code, 'png', true)} download={`swapyard-link-${code}.png`} className="font-bold text-ink underline">
          Download QR (PNG)
        </a>
        <a href={qrUrl(code, 'svg', true)} download={`swapyard-link-${code}.svg`} className="font-bold text-ink underline">
          Download QR (SVG)
        </a>
      </div>
    </div>
  );
}
