// A path the app answered before the estate existed and the estate's read of the same row share one
// request (GET /strings/{id}: the string page plus its editable fields, routes/estate.ts). The first
// leaves the row it read in res.locals under this name, so the estate's read does not read it again.
export const READ_ROW = 'estateRowRead'
