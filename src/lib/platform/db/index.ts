import { config } from '../config';
import { connect } from './connect';

export const { db, client } = connect(config.databaseUrl, config.databaseAuthToken);
