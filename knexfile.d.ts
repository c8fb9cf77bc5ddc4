import type { Knex } from 'knex';
export declare const connection: string;
declare const config: Knex.Config;
export default config;
