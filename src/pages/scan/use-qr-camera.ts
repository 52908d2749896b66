import { onBeforeUnmount, ref, type Ref } from 'vue'

export type CameraState = 'idle' | 'starting' | 'scanning' | 'denied' | 'absent' | 'insecure' | 'failed'

// The Shape Detection API is not in TypeScript's DOM library yet (WICG "Accelerated Shape Detection").
interface Detector {
  detect(source: HTMLVideoElement): Promise<{ rawValue: string }[]>
}
interface DetectorClass {
  new (options: { formats: string[] }): Detector
  getSupportedFormats(): Promise<string[]>
}
type JsQr = (typeof import('jsqr'))['default']

// About five looks a second finds a label within a moment and spares a phone's battery.
const FRAME_MS = 200
// jsqr's work grows with pixels; a label fills enough of the frame at this width.
const MAX_SCAN_WIDTH = 640

async function nativeDetector(): Promise<Detector | null> {
  const Cls = (window as unknown as { BarcodeDetector?: DetectorClass }).BarcodeDetector
  if (!Cls) return null
  try {
    return (await Cls.getSupportedFormats()).includes('qr_code') ? new Cls({ formats: ['qr_code'] }) : null
  } catch {
    return null
  }
}

/** Rear camera into `video`, decoding QR codes until `stop()`; `onCode` gets each decoded text. */
export function useQrCamera(video: Ref<HTMLVideoElement | null>, onCode: (text: string) => void) {
  const state = ref<CameraState>('idle')
  let stream: MediaStream | null = null
  let timer: ReturnType<typeof setTimeout> | undefined
  let detector: Detector | null = null
  let jsqr: JsQr | null = null
  let canvas: HTMLCanvasElement | null = null
  // Bumped by every start and stop: a camera that opens after the user has left (or started it
  // again) must be closed at once.
  let generation = 0

  async function start(): Promise<void> {
    if (stream || state.value === 'starting') return
    if (!window.isSecureContext) return void (state.value = 'insecure')
    if (!navigator.mediaDevices?.getUserMedia) return void (state.value = 'absent')
    state.value = 'starting'
    const mine = ++generation
    let opened: MediaStream
    try {
      opened = await navigator.mediaDevices.getUserMedia({
        video: { facingMode: { ideal: 'environment' }, width: { ideal: 1280 } },
        audio: false,
      })
    } catch (err) {
      const name = err instanceof DOMException ? err.name : ''
      if (mine !== generation) return
      state.value =
        name === 'NotAllowedError' || name === 'SecurityError'
          ? 'denied'
          : name === 'NotFoundError' || name === 'OverconstrainedError'
            ? 'absent'
            : 'failed'
      return
    }
    if (mine !== generation) return opened.getTracks().forEach((t) => t.stop())
    stream = opened
    const v = video.value
    if (!v) return stop()
    v.srcObject = stream
    await v.play().catch(() => undefined)
    detector = await nativeDetector()
    // Most browsers other than Chromium on Android lack a native detector; load the decoder only then.
    if (!detector && !jsqr) jsqr = (await import('jsqr')).default
    if (mine !== generation) return
    state.value = 'scanning'
    next()
  }

  function next(): void {
    clearTimeout(timer)
    timer = setTimeout(() => void look(), FRAME_MS)
  }

  async function look(): Promise<void> {
    const v = video.value
    if (!stream || !v) return
    if (v.readyState >= 2 && v.videoWidth > 0) {
      const text = detector ? await detectNative(v) : decodeFrame(v)
      if (!stream) return
      if (text) onCode(text)
    }
    if (stream) next()
  }

  async function detectNative(v: HTMLVideoElement): Promise<string | null> {
    try {
      return (await detector!.detect(v))[0]?.rawValue ?? null
    } catch {
      return null
    }
  }

  function decodeFrame(v: HTMLVideoElement): string | null {
    if (!jsqr) return null
    const scale = Math.min(1, MAX_SCAN_WIDTH / v.videoWidth)
    const w = Math.round(v.videoWidth * scale)
    const h = Math.round(v.videoHeight * scale)
    canvas ??= document.createElement('canvas')
    canvas.width = w
    canvas.height = h
    const ctx = canvas.getContext('2d', { willReadFrequently: true })
    if (!ctx) return null
    ctx.drawImage(v, 0, 0, w, h)
    const found = jsqr(ctx.getImageData(0, 0, w, h).data, w, h, { inversionAttempts: 'dontInvert' })
    return found?.data || null
  }

  function stop(): void {
    generation++
    clearTimeout(timer)
    stream?.getTracks().forEach((t) => t.stop())
    stream = null
    if (video.value) video.value.srcObject = null
    if (state.value === 'scanning' || state.value === 'starting') state.value = 'idle'
  }

  // A camera left running in a pocket drains the battery and keeps the privacy light on.
  function onVisibility(): void {
    if (document.hidden) stop()
  }
  document.addEventListener('visibilitychange', onVisibility)
  onBeforeUnmount(() => {
    document.removeEventListener('visibilitychange', onVisibility)
    stop()
  })

  return { state, start, stop }
}
