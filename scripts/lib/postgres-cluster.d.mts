export function postgresBin(): string | undefined
export function startPostgres(): Promise<{ url: string, stop: () => Promise<void> }>
