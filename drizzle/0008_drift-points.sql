ALTER TABLE `unit_latest_evaluations` ADD `drift_points` json;--> statement-breakpoint
-- Each latest evaluation gets the points its drift was fitted over: the unit's readings with a
-- deviation in the five years (5 × 365.25 days) up to it, as [epoch ms, deviation %], oldest first.
-- The session's own limit on an aggregate's length, so a long history is never cut short.
SET SESSION group_concat_max_len = 1073741824;--> statement-breakpoint
UPDATE `unit_latest_evaluations` AS `latest`
SET `drift_points` = COALESCE(
  (
    SELECT JSON_ARRAYAGG(
      JSON_ARRAY(TIMESTAMPDIFF(MICROSECOND, '1970-01-01 00:00:00', `history`.`recorded_at`) DIV 1000, `history`.`deviation_pct`)
      ORDER BY `history`.`recorded_at`
    )
    FROM `readings` AS `history`
    WHERE `history`.`target` = 'capacitor-unit'
      AND `history`.`target_id` = `latest`.`unit_id`
      AND `history`.`deviation_pct` IS NOT NULL
      AND `history`.`recorded_at` <= `latest`.`recorded_at`
      AND `history`.`recorded_at` >= `latest`.`recorded_at` - INTERVAL 157788000 SECOND
  ),
  JSON_ARRAY()
);
