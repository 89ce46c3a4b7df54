export { createHostClient, host, pickTransport, type HostClient, type HostTransport } from './hostClient';
