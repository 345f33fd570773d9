/** Longitude then latitude in degrees, as in GeoJSON. */
export type LonLat = [number, number]

export type ObstacleKind = 'point' | 'line' | 'polygon'

interface ObstacleFields {
  /** Client-made id, stable across edits. */
  id: string
  label: string
  /** Height of the obstacle top above the ground at its base, metres. */
  heightM: number
}
export interface PointObstacleDto extends ObstacleFields {
  kind: 'point'
  coordinates: LonLat
}
export interface LineObstacleDto extends ObstacleFields {
  kind: 'line'
  coordinates: LonLat[]
}
/** A ring, closed or not. */
export interface PolygonObstacleDto extends ObstacleFields {
  kind: 'polygon'
  coordinates: LonLat[]
}
export type CourseObstacle = PointObstacleDto | LineObstacleDto | PolygonObstacleDto

/** The planned route: a GeoJSON LineString. */
export interface RouteLineString {
  type: 'LineString'
  coordinates: LonLat[]
}

export type TerrainFormat = 'geotiff' | 'hgt'

export interface CourseTerrainDto {
  id: number
  format: TerrainFormat
  fileName: string
  width: number
  height: number
  /** west, south, east, north in degrees. */
  bbox: [number, number, number, number]
  minElevM: number
  maxElevM: number
  createdAt: string
}

export interface CourseDto {
  id: number
  teamId: number
  createdBy: number | null
  name: string
  notes: string
  stationLat: number
  stationLon: number
  /** Ground antenna height above the ground, metres. */
  antennaHeightM: number
  /** Ground elevation at the station above mean sea level, metres. */
  groundElevM: number
  route: RouteLineString | null
  obstacles: CourseObstacle[]
  terrainId: number | null
  hasTerrain: boolean
  terrain: CourseTerrainDto | null
  createdAt: string
  updatedAt: string
}

/** GET /api/courses/:courseId/terrain/profile: evenly spaced terrain samples from one point to another. */
export interface TerrainProfileDto {
  /** Ground distance from the start, metres. */
  distanceM: number[]
  /** Terrain elevation above mean sea level, metres; null outside the uploaded data. */
  elevationM: (number | null)[]
}

/** Sortable columns of GET /api/courses. */
export const COURSE_SORT_KEYS = ['name', 'createdAt', 'updatedAt'] as const
export type CourseSortKey = (typeof COURSE_SORT_KEYS)[number]
