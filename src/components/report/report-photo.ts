// The report's one photo, sent after the report with the one-time key its answer gave. A photo that
// fails never loses the report: the receipt says so and the report stands. (A sentence on the receipt,
// not a Notify toast: the public pages do not load Quasar's Notify plugin, issue 14.)
import { isApiError } from '../../api/http'
import { reportWorkApi } from '../../api/report-work'

/** Sends the photo, if any; the sentence to show when it did not arrive, else null. */
export async function sendReportPhoto(
  status: { ref: string; photoKey?: string },
  photo: File | null,
): Promise<string | null> {
  if (!photo || !status.photoKey) return null
  try {
    await reportWorkApi.reportPhoto(status.ref, status.photoKey, photo, photo.name || 'photo.jpg')
    return null
  } catch (err) {
    const why = isApiError(err) ? `: ${err.message}` : '.'
    return `Your report is in, but the photo did not arrive${why}`
  }
}
