import type { OpenSafetyFlag } from './flags';
import type { Axle, Category, RevisionStatus } from './enums';
import type { BrakeCorner, SwapData } from './swap-data';
import type { Role } from '../roles';
import type { VehicleData } from './vehicle';
import type { ChassisWheelFastening } from './wheel-fastening';

// Shapes of what the read API returns. The server builds them; the client types its queries with them.

export type PersonRef = { login: string; name: string; avatarUrl: string | null };

/** a chassis' factory brake corner, disc or drum, with a sentence describing it */
export type StockBrakeCornerView = BrakeCorner & { description: string };

export type ChassisView = {
  id: number;
  slug: string;
  make: string;
  model: string;
  code: string;
  yearFrom: number;
  yearTo: number | null;
  body: string;
  lugCount: number;
  pcdMm: number;
  centreBoreMm: number;
  wheelBoltThread: string;
  stockWheel: { diameterIn: number; widthIn: number; offsetMm: number; tyre: string };
  stockBrakes: { front: StockBrakeCornerView; rear: StockBrakeCornerView };
  /** stock figures for the brake-distribution analysis; null when the catalogue has none */
  vehicle: VehicleData | null;
  /** the factory wheel fastener and the hubs; null when not recorded */
  wheelFastening: ChassisWheelFastening | null;
  notes: string;
};

export type PhotoView = {
  id: string;
  caption: string;
  width: number;
  height: number;
  url: string;
  thumbUrl: string;
  /** a moderator took it down: only its author and the review desk get it, marked so */
  takenDown?: boolean;
};

export type RevisionSummary = {
  number: number;
  status: RevisionStatus;
  approvedAt: string | null;
  author: PersonRef;
  /** a correction's "what changed and why" */
  changeNote: string | null;
};

export type SwapSheetView = {
  swap: {
    id: number;
    slug: string;
    axle: Axle;
    category: Category;
    fittedCount: number;
    author: PersonRef;
    createdAt: string;
  };
  chassis: ChassisView;
  revision: {
    id: number;
    number: number;
    status: RevisionStatus;
    data: SwapData;
    body: string;
    approvedAt: string | null;
    submittedAt: string | null;
    author: PersonRef;
    photos: PhotoView[];
    /** a moderator took the write-up down: `body` is empty and the sheet says why */
    bodyTakenDown: boolean;
  };
  /** number of the swap's current (latest approved) revision */
  currentNumber: number | null;
  /** approved and superseded revisions, newest first */
  history: RevisionSummary[];
  /** open flags about a safety figure: readers are told the sheet is questioned until a moderator settles it */
  openSafetyFlags: OpenSafetyFlag[];
};

export type SwapCard = {
  slug: string;
  title: string;
  summary: string;
  axle: Axle;
  category: Category;
  chassis: { slug: string; make: string; model: string; code: string; yearFrom: number; yearTo: number | null };
  revisionNumber: number;
  approvedAt: string | null;
  fittedCount: number;
  minWheelIn: number | null;
  thumbUrl: string | null;
};

/** `proposed`: proposed with a submission and not approved yet (only its author and reviewers see it) */
export type ChassisPageView = { chassis: ChassisView; proposed: boolean; swaps: SwapCard[] };

export type PartView = {
  id: number;
  slug: string;
  kind: string;
  name: string;
  maker: string;
  partNumbers: string[];
  specs: Record<string, unknown>;
  cameOn: string[];
  notes: string;
};

export type PartPageView = { part: PartView; swaps: SwapCard[] };

export type MeView = {
  user: {
    id: number;
    login: string;
    name: string;
    avatarUrl: string | null;
    role: Role;
    shop: { slug: string; name: string } | null;
  } | null;
  csrfToken: string;
};
