/** Panel review across a workspace: every case reviewed and ranked by urgency (one function for the CLI and the Cases screen). */
export * from './rankPanel';
