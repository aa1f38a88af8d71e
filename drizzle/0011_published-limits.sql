-- Each tolerance profile version keeps its limits as published (values.published). A figure still at the
-- published default gets both printed figures (0.13 mm and 0.005 in, TRADE.md, S); a figure the team typed gets
-- its own figure in mm or N·m, the unit it was stored in. Versions already carrying published figures are left.
UPDATE `tolerance_profile_versions`
SET `values` = json_set(`values`, '$.published', json_object(
  'backlashMin', json(CASE WHEN json_extract(`values`, '$.backlashMin') = 0.13
    THEN '{"mm":"0.13","in":"0.005"}'
    ELSE json_object('mm', CAST(json_extract(`values`, '$.backlashMin') AS TEXT)) END),
  'backlashMax', json(CASE WHEN json_extract(`values`, '$.backlashMax') = 0.23
    THEN '{"mm":"0.23","in":"0.009"}'
    ELSE json_object('mm', CAST(json_extract(`values`, '$.backlashMax') AS TEXT)) END),
  'maxSpread', json(CASE WHEN json_extract(`values`, '$.maxSpread') = 0.05
    THEN '{"mm":"0.05","in":"0.002"}'
    ELSE json_object('mm', CAST(json_extract(`values`, '$.maxSpread') AS TEXT)) END),
  'runoutMax', json(CASE WHEN json_extract(`values`, '$.runoutMax') = 0.076
    THEN '{"mm":"0.076","in":"0.003"}'
    ELSE json_object('mm', CAST(json_extract(`values`, '$.runoutMax') AS TEXT)) END),
  'pinionPreloadNew', json_object(
    'min', json(CASE WHEN json_extract(`values`, '$.pinionPreloadNew.min') = 2.7
      THEN '{"N-m":"2.7","lbf-in":"24"}'
      ELSE json_object('N-m', CAST(json_extract(`values`, '$.pinionPreloadNew.min') AS TEXT)) END),
    'max', json(CASE WHEN json_extract(`values`, '$.pinionPreloadNew.max') = 3.6
      THEN '{"N-m":"3.6","lbf-in":"32"}'
      ELSE json_object('N-m', CAST(json_extract(`values`, '$.pinionPreloadNew.max') AS TEXT)) END)),
  'pinionPreloadUsed', json_object(
    'min', json(CASE WHEN json_extract(`values`, '$.pinionPreloadUsed.min') = 1.0
      THEN '{"N-m":"1.0","lbf-in":"8"}'
      ELSE json_object('N-m', CAST(json_extract(`values`, '$.pinionPreloadUsed.min') AS TEXT)) END),
    'max', json(CASE WHEN json_extract(`values`, '$.pinionPreloadUsed.max') = 1.4
      THEN '{"N-m":"1.4","lbf-in":"12"}'
      ELSE json_object('N-m', CAST(json_extract(`values`, '$.pinionPreloadUsed.max') AS TEXT)) END))
))
WHERE json_extract(`values`, '$.published') IS NULL;
