import { z } from 'zod';
import { parseThread } from '../fitment/threads';
import { FitmentInputError } from '../fitment/errors';

// How a chassis holds its wheels: the factory fastener and the hub it screws into. Stored with the chassis
// (one JSON column), read by the wheel checks of every swap on it. Lengths in millimetres.

export const fastenerTypes = ['bolt', 'stud_nut'] as const;
export const fastenerSeats = ['cone60', 'ball', 'flat'] as const;
export const hubMaterials = ['steel', 'aluminium'] as const;
export const hubHoles = ['blind', 'through'] as const;
export const lengthReferences = ['under_head', 'seat_end'] as const;

/** A thread designation the fastening computations read: metric with its pitch or unified with threads per inch. */
export const threadDesignation = (max = 30) =>
  z
    .string()
    .trim()
    .max(max)
    .superRefine((v, ctx) => {
      try {
        parseThread(v);
      } catch (err) {
        ctx.addIssue({
          code: 'custom',
          message: err instanceof FitmentInputError ? err.message : 'A thread like M12x1.5 or 1/2-20 UNF',
        });
      }
    });

const ballRadius = z.number().positive().max(30);

/** one axle's hub, as far as the wheel fastening is concerned */
export const hubFiguresSchema = z.object({
  /** usable thread depth of the hub's bolt holes (bolt chassis) */
  threadDepthMm: z.number().positive().max(80).optional(),
  /** a blind hole ends in metal; a through hole opens behind the hub */
  hole: z.enum(hubHoles).optional(),
  /** length of the centring spigot, from the hub face */
  spigotLengthMm: z.number().positive().max(60).optional(),
  /** measured free space behind the bolt holes, before a drum-in-hat parking brake or dust shield */
  clearanceBehindMm: z.number().min(0).max(100).optional(),
});
export type HubFigures = z.infer<typeof hubFiguresSchema>;

export const chassisWheelFasteningSchema = z
  .object({
    fastener: z.enum(fastenerTypes),
    /** seat of the factory bolt head or nut */
    seat: z.enum(fastenerSeats),
    /** ball seats: the sphere's radius */
    ballRadiusMm: ballRadius.optional(),
    /** axial height of the cone or ball on the bolt head or nut */
    seatHeightMm: z.number().positive().max(20).optional(),
    /** factory bolt length, or for studs the length standing out of the hub face */
    stockLengthMm: z.number().positive().max(150).optional(),
    /** where a bolt length is measured from: under the head (a cone or ball included) or from where the seat ends */
    lengthFrom: z.enum(lengthReferences).default('seat_end'),
    /** studs: thread length of the factory nut, from where its seat ends */
    nutThreadMm: z.number().positive().max(60).optional(),
    /** studs: closed (dome) nuts are blind */
    nutClosed: z.boolean().default(false),
    hubMaterial: z.enum(hubMaterials),
    front: hubFiguresSchema.default({}),
    rear: hubFiguresSchema.default({}),
  })
  .superRefine((f, ctx) => {
    if (f.seat === 'ball' && f.ballRadiusMm === undefined)
      ctx.addIssue({ code: 'custom', path: ['ballRadiusMm'], message: 'Give the ball seat’s radius' });
    if (f.seat !== 'ball' && f.ballRadiusMm !== undefined)
      ctx.addIssue({ code: 'custom', path: ['ballRadiusMm'], message: 'Only a ball seat has a radius' });
    if (f.fastener === 'bolt' && f.lengthFrom === 'under_head' && f.seat !== 'flat' && f.seatHeightMm === undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['seatHeightMm'],
        message: 'A length measured under the head needs the seat’s height, so thread is counted from where the seat ends',
      });
  });
export type ChassisWheelFastening = z.infer<typeof chassisWheelFasteningSchema>;
export type ChassisWheelFasteningInput = z.input<typeof chassisWheelFasteningSchema>;
