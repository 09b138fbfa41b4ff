export { formatLength, LengthParseError, MM_PER_INCH, parseLength, type FormatLengthOptions } from './length';
