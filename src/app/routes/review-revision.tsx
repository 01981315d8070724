import type { SubmissionView } from '@shared/schemas/submissions';
import type { SwapSheetView } from '@shared/schemas/views';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import { ReviewPage } from '../../features/review/components/review-page';
import { SwapSheet } from '../../features/swaps/components/swap-sheet-page';

// The review desk shows a revision through the swap sheet itself; the two features meet here.

/** The sheet's view of a revision that is not published yet. */
export function sheetViewOf(r: SubmissionView): SwapSheetView {
  return {
    swap: {
      id: r.swapId,
      slug: r.swapSlug,
      axle: r.axle,
      category: r.category,
      fittedCount: 0,
      author: r.author,
      createdAt: r.submittedAt ?? r.updatedAt,
    },
    chassis: r.chassis,
    revision: {
      id: r.id,
      number: r.number,
      status: r.status,
      data: r.data,
      // as readers will see it: without what a moderator took down
      body: r.bodyTakenDown ? '' : r.body,
      bodyTakenDown: r.bodyTakenDown,
      approvedAt: r.status === 'approved' ? r.reviewedAt : null,
      submittedAt: r.submittedAt,
      author: r.author,
      photos: r.photos.filter((p) => !p.takenDown),
    },
    // no "newer revision" banner: this is the revision under review
    currentNumber: null,
    openSafetyFlags: [],
    history: [],
  };
}

export default function ReviewRevisionRoute() {
  return (
    <RequireSignedIn permission="review" what="the review desk">
      <ReviewPage
        sheet={(r) => (
          <SwapSheet
            view={sheetViewOf(r)}
            banner={
              r.status === 'approved' ? undefined : (
                <p role="note" className="mb-4 rounded-lg border border-brass bg-brass-soft/40 p-3 text-sm">
                  Preview of revision {r.number} as readers will see it once approved. It is not public yet.
                </p>
              )
            }
          />
        )}
      />
    </RequireSignedIn>
  );
}
