declare module 'leaflet/dist/leaflet-src.esm' {
  export * from 'leaflet'
}
