/**
 * Wraps a random-access file holding raw interleaved little-endian int16
 * voltage (frame = one sample of every channel) as a RawSource. Nothing is
 * loaded up front: readFrames reads only the requested frames.
 *
 * Errors (InputError naming the file): a size that is not a whole number of
 * frames (usually a wrong channel_count), an empty file.
 * readFrames clips the request to the file: frames before 0 or past the end
 * are not returned (the result holds min(count, available) frames).
 */
import { InputError } from '../errors';
import type { RawSource } from '../model/types';
import type { RandomAccessFile } from './session-source';

export function createRawSource(
  f: RandomAccessFile,
  spec: { file: string; channelCount: number; sampleRateHz: number; gainUvPerBit: number; startS: number; channelIds?: readonly string[] },
): RawSource {
  const frameBytes = 2 * spec.channelCount;
  if (f.size === 0) throw new InputError({ file: spec.file, problem: 'the raw voltage file is empty' });
  if (f.size % frameBytes !== 0) {
    throw new InputError({
      file: spec.file,
      value: String(f.size),
      problem: `the file size in bytes is not a whole number of frames of ${spec.channelCount} int16 channels`,
      fix: 'check raw.channel_count in session.json (and that the file is raw int16 without a header)',
    });
  }
  const frameCount = f.size / frameBytes;
  return {
    file: spec.file,
    channelCount: spec.channelCount,
    sampleRateHz: spec.sampleRateHz,
    gainUvPerBit: spec.gainUvPerBit,
    frameCount,
    startS: spec.startS,
    ...(spec.channelIds ? { channelIds: spec.channelIds } : {}),
    readFrames(startFrame: number, count: number): Int16Array {
      const a = Math.max(0, Math.floor(startFrame));
      const b = Math.min(frameCount, Math.floor(startFrame) + Math.max(0, Math.floor(count)));
      if (b <= a) return new Int16Array(0);
      const bytes = f.read(a * frameBytes, (b - a) * frameBytes);
      const out = new Int16Array((b - a) * spec.channelCount);
      // copy through a DataView: the bytes may be unaligned; int16 is little-endian on disk
      const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
      for (let i = 0; i < out.length; i++) out[i] = dv.getInt16(2 * i, true);
      return out;
    },
  };
}
