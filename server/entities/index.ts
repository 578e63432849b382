// Every entity, listed once. A new entity is added here and gets a migration.
import { AuditEntry } from './AuditEntry.js'
import { User } from './User.js'

export const allEntities = [User, AuditEntry]
