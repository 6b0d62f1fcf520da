#!/usr/bin/env bash
# Before the first release only: regenerates migrations/ from the whole schema as one initial migration.
# Once a release has applied a migration, never run this again: add a new migration with `npm run db:generate`.
source "$(dirname "$0")/lib/common.sh"
rm -rf migrations
node_modules/.bin/drizzle-kit generate --name init
