// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { SectionDrawing } from '../../../src/components/section-drawing';
import { UnitsProvider } from '../../../src/lib/units';
import type { SectionPoint } from '../../../shared/fitment/section';

afterEach(cleanup);

const pt = (zMm: number, rMm: number): SectionPoint => ({ zMm, rMm });
const box = (z0: number, z1: number, r0: number, r1: number) => [pt(z0, r0), pt(z1, r0), pt(z1, r1), pt(z0, r1)];
// barrel r = 200, a 45° chamfer of 8 mm each way (z + r = 232), spokes at z = 40
const fillet = [pt(-60, 200), pt(32, 200), pt(40, 192), pt(40, 100)];

const draw = (props: Partial<Parameters<typeof SectionDrawing>[0]> = {}) =>
  render(
    <UnitsProvider>
      <SectionDrawing caliper={box(-70, 35, 120, 195)} wheel={fillet} {...props} />
    </UnitsProvider>,
  );

describe('SectionDrawing', () => {
  it('when the fillet is nearest, then the picture and its caption say where and how far, rounded down', () => {
    // plane geometry, point-to-line distance: corner (35, 195) to z + r = 232 is √2 = 1.414 mm, at (36, 196)
    draw({ rotorDiameterMm: 330 });
    const figure = screen.getByRole('img', { name: 'Section through the axle' });
    const caption = document.getElementById(figure.getAttribute('aria-describedby')!)!;
    expect(caption.textContent).toContain('Nearest point: 1.4 mm between the caliper and the fillet.');
    expect(caption.textContent).toContain('36 mm outboard of the hub face and 196 mm from the axle centre');
    expect(figure.textContent).toContain('1.4 mm');
    expect(figure.textContent).toContain('rotor edge');
    expect(figure.textContent).toContain('fillet');
  });

  it('when the caliper overlaps the barrel, then it says by how much and shades the overlap', () => {
    // plane geometry: top r = 205 over r = 200 → 5 mm overlap
    const { container } = draw({ caliper: box(-70, 20, 120, 205) });
    expect(screen.getByText(/The caliper overlaps the barrel by 5 mm\./)).toBeTruthy();
    expect(container.querySelector('polygon[clip-path]')).not.toBeNull();
  });

  it('when a spacer is given, then the wheel is drawn moved and the caption names it', () => {
    // plane geometry: a 10 mm spacer moves the spokes to z = 50; the face z = 36 of a box under a square corner → 14 mm
    draw({ caliper: box(-70, 36, 120, 190), wheel: [pt(-60, 200), pt(40, 200), pt(40, 100)], spacerMm: 10 });
    expect(screen.getByText(/Nearest point: 10 mm between the caliper and the barrel\..*With a 10 mm spacer\./)).toBeTruthy();
  });

  it('when drawn from the legacy numbers, then it is labelled an estimate', () => {
    draw({ estimate: true });
    expect(screen.getByText(/An estimate from two recorded numbers/)).toBeTruthy();
    expect(screen.getByRole('img').textContent).toContain('≈ 1.4 mm');
  });

  it('when there are too few points, then it says what it needs instead of drawing', () => {
    draw({ caliper: box(-70, 35, 120, 195).slice(0, 2) });
    expect(screen.queryByRole('img')).toBeNull();
    expect(screen.getByText(/at least three caliper points/)).toBeTruthy();
  });
});
