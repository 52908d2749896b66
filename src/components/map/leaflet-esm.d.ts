// vue-leaflet loads Leaflet's ES build; importing the same file keeps one copy of Leaflet in the
// bundle (the package's "main" is a second, UMD copy). Its types are Leaflet's own.
declare module 'leaflet/dist/leaflet-src.esm' {
  export * from 'leaflet'
}
