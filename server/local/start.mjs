import { bootstrap } from './bootstrap.mjs'

bootstrap('start', process.argv.slice(2))
