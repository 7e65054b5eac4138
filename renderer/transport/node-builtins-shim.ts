// Stands in for the Node modules that workerpool's browser build names only on its Node paths
// (`os`, `worker_threads`, `child_process`): in the preview they are never reached, and the alias
// keeps the bundler from warning about them in a user's terminal.
export default {};
