import { Link } from 'react-router';

export function Footer() {
  return (
    <footer className="no-print mt-16 border-t border-ink/15 bg-paper-deep">
      <div className="mx-auto grid max-w-sheet gap-6 px-4 py-8 text-sm text-graphite-soft sm:grid-cols-3 sm:px-6">
        <div>
          <p className="font-extrabold text-ink">Swapyard</p>
          <p className="mt-1">Reviewed records of what fits which car, written by the people who fitted it.</p>
        </div>
        <nav aria-label="Footer">
          <ul className="space-y-1">
            <li>
              <Link className="hover:text-ink" to="/search">
                Find a swap
              </Link>
            </li>
            <li>
              <Link className="hover:text-ink" to="/tools">
                Fitment calculators
              </Link>
            </li>
            <li>
              <Link className="hover:text-ink" to="/submit">
                Record a swap you fitted
              </Link>
            </li>
            <li>
              <Link className="hover:text-ink" to="/open-data">
                Open data (CC BY-SA 4.0)
              </Link>
            </li>
            <li>
              <Link className="hover:text-ink" to="/api-docs">
                Public API
              </Link>
            </li>
          </ul>
        </nav>
        <p>
          Figures here are members’ measurements and textbook estimates, not a guarantee of fit or of road legality. Brake and
          wheel work is safety critical: follow the manufacturers’ specifications, your local rules, and have it inspected by a
          qualified technician.
        </p>
      </div>
    </footer>
  );
}
