export { countWords } from './words';
export { forecastEpisode, spokenSeconds, type EpisodeForecast, type ForecastInput, type SegmentForecast } from './forecast';
export { formatDuration, parseDuration } from './duration';
