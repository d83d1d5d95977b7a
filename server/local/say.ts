/** Progress lines for `npm start` and `npm test`, so a long first run never sits silent. */
export function step(message: string): void {
  console.log(`▸ ${message}`)
}

export function done(message: string): void {
  console.log(`✔ ${message}`)
}
