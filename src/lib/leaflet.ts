// The Leaflet build vue-leaflet itself loads (its ESM file, with useGlobalLeaflet off), so the layers
// we create belong to the same Leaflet as the map BaseMap makes; plain 'leaflet' would be a second copy.
import * as L from 'leaflet/dist/leaflet-src.esm'

export { L }
