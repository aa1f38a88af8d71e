-- Storage keys leave the audit trail: a photo's audit entries kept the whole row, keys included.
UPDATE `audit_events` SET `after` = json_remove(`after`, '$.storageKey', '$.thumbnailKey') WHERE `record_type` = 'inspection-photo' AND json_valid(`after`);--> statement-breakpoint
UPDATE `audit_events` SET `before` = json_remove(`before`, '$.storageKey', '$.thumbnailKey') WHERE `record_type` = 'inspection-photo' AND json_valid(`before`);
