// The report's one photo, sent after the report with the one-time key its answer gave. A photo that
// fails never loses the report: the person is told and the report stands.
import { Notify } from 'quasar'
import { isApiError } from '../../api/http'
import { reportWorkApi } from '../../api/report-work'

export async function sendReportPhoto(
  status: { ref: string; photoKey?: string },
  photo: File | null,
): Promise<void> {
  if (!photo || !status.photoKey) return
  try {
    await reportWorkApi.reportPhoto(status.ref, status.photoKey, photo, photo.name || 'photo.jpg')
  } catch (err) {
    const why = isApiError(err) ? `: ${err.message}` : '.'
    Notify.create({
      type: 'warning',
      message: `Your report ${status.ref} is in, but the photo did not arrive${why}`,
    })
  }
}
