/**
 * SQL for points on the unit sphere (the `cube` contrib module), shared by every search that uses
 * technicians.sphere_point and its GiST index. The site's point is computed by the same expression as the column, so
 * both ends of a chord come from the same arithmetic. Arguments are SQL placeholders or expressions, never values.
 */
export function spherePointSql(latitude: string, longitude: string): string {
  return `cube(ARRAY[cos(radians(${latitude}::float8)) * cos(radians(${longitude}::float8)),
    cos(radians(${latitude}::float8)) * sin(radians(${longitude}::float8)), sin(radians(${latitude}::float8))])`;
}

/** Technicians inside the cube of half-side `halfSide` around `point`: the index's prefilter, never the exact test. */
export function withinCubeSql(point: string, halfSide: string): string {
  return `t.sphere_point <@ cube_enlarge(${point}, ${halfSide}, 3)`;
}
