// Preloaded into the app when `npm run bench -- --cpu-prof DIR` profiles it: a plain SIGTERM would end the process
// before V8 writes the profile; an orderly exit writes it.
process.on('SIGTERM', () => process.exit(0));
