// Takeoff unit-test fixtures: the 8x8 test block and a 6 ft × 7 ft spacer-joint wall that each takeoff
// test tweaks, kept in one place so the tests agree on the worked example they start from.
import { wallSchema, type BlockSpec, type Wall } from '../../shared/schemas/takeoff.js'
import { isWallRefusal, layoutWall, type WallGeometry } from '../../shared/takeoff/wallLayout.js'

export const IN = 25.4 // NIST SP 811: 1 in = 25.4 mm exactly
export const FT = 304.8 // NIST SP 811: 1 ft = 0.3048 m exactly

// 8x8 nominal: face 7 3/4 in (common practice), standard depth 3 7/8 in (IRC 2021 R607.3); 2.5 kg is a demo weight
export const block8 = { nominal: '8x8', faceWidthMm: 7.75 * IN, faceHeightMm: 7.75 * IN, depthMm: 3.875 * IN, thicknessClass: 'standard' as const, weightKg: 2.5 }

/** A wall builder: 84 in high, one 72 in straight run, 1/8 in spacer joints, interior, no free ends. */
export function wallMaker(name: string, block: BlockSpec = block8): (over?: Partial<Wall>) => Wall {
  return (over = {}) =>
    wallSchema.parse({
      name,
      sizing: 'opening',
      heightMm: 84 * IN,
      block,
      joint: { kind: 'spacer', jointMm: IN / 8 },
      segments: [{ kind: 'straight', lengthMm: 72 * IN }],
      freeEnds: { start: false, end: false, top: false },
      exposure: 'interior',
      wetArea: false,
      ...over,
    })
}

/** Lays a wall out in inches; a refusal fails the test with its reason. */
export function laid(w: Wall): WallGeometry {
  const g = layoutWall(w, 'in')
  if (isWallRefusal(g)) throw new Error(g.reason)
  return g
}
