// smpte-timecode 1.3.6 ships no types; only what the reference test uses is declared.
declare module 'smpte-timecode' {
  type SmpteTimecode = {
    frameCount: number;
    dropFrame: boolean;
    toString(): string;
  };
  function Timecode(timeCode: number | string, frameRate?: number | [number, number], dropFrame?: boolean): SmpteTimecode;
  export = Timecode;
}
