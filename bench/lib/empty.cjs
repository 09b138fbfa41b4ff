// Stands in for 'server-only' in benchmarks.
