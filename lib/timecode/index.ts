export { frameRateIds, frameRates, framesPerSecond, isFrameRateId, nearestFrameRate, type FrameRate, type FrameRateId } from './rates';
export {
  formatTimecode,
  frameSeparator,
  framesPerDay,
  framesToParts,
  framesToSeconds,
  framesToTimecode,
  partsToFrames,
  playerTimeToTimecode,
  secondsToFrames,
  timecodeToFrames,
  TimecodeError,
  type TimecodeParts,
} from './timecode';
