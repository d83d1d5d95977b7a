import { bootstrap } from './bootstrap.mjs'

bootstrap('test', process.argv.slice(2))
