// Every table of Veerline, one file per area. drizzle.config.ts and useDB() read this index.
export * from './users'
export * from './audit'
export * from './airfields'
export * from './profiles'
export * from './briefing'
export * from './alerts'
export * from './feeds'
export * from './sessions'
