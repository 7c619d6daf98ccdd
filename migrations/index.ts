import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201174640_initial } from './Migration20261201174640_initial';
import { Migration20261201175515_register_and_designs } from './Migration20261201175515_register_and_designs';
import { Migration20261201180718_register_and_surveys } from './Migration20261201180718_register_and_surveys';
import { Migration20261201181934_billing } from './Migration20261201181934_billing';
import { Migration20261201182920_dockings_and_renewals } from './Migration20261201182920_dockings_and_renewals';
import { Migration20261202003500_design_record } from './Migration20261202003500_design_record';
import { Migration20261202011500_demand_method } from './Migration20261202011500_demand_method';
import { Migration20261203090000_asset_survey_criteria } from './Migration20261203090000_asset_survey_criteria';
import { Migration20261203100000_renewal_threshold } from './Migration20261203100000_renewal_threshold';
import { Migration20261204100000_exactly_once } from './Migration20261204100000_exactly_once';
import { Migration20261204200000_rate_limit } from './Migration20261204200000_rate_limit';
import { Migration20261204300000_subscription_unique } from './Migration20261204300000_subscription_unique';
import { Migration20261204500000_worker_heartbeat } from './Migration20261204500000_worker_heartbeat';
import { Migration20261204600000_survey_corrections } from './Migration20261204600000_survey_corrections';
import { Migration20261206600000_attachment_undo } from './Migration20261206600000_attachment_undo';
import { Migration20261214000000_structured_positions } from './Migration20261214000000_structured_positions';
import { Migration20261218000000_reading_device_ids_kept } from './Migration20261218000000_reading_device_ids_kept';
import { Migration20261216000000_position_parser_version } from './Migration20261216000000_position_parser_version';
import { Migration20261210000000_asset_outlook } from './Migration20261210000000_asset_outlook';
import { Migration20261211000000_object_storage } from './Migration20261211000000_object_storage';
import { Migration20261212000000_capture_device_id } from './Migration20261212000000_capture_device_id';

// Every migration, in order. `npm run migrate -- create <name>` writes a new file; add it here.
export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261201174640_initial', class: Migration20261201174640_initial },
  { name: 'Migration20261201175515_register_and_designs', class: Migration20261201175515_register_and_designs },
  { name: 'Migration20261201180718_register_and_surveys', class: Migration20261201180718_register_and_surveys },
  { name: 'Migration20261201181934_billing', class: Migration20261201181934_billing },
  { name: 'Migration20261201182920_dockings_and_renewals', class: Migration20261201182920_dockings_and_renewals },
  { name: 'Migration20261202003500_design_record', class: Migration20261202003500_design_record },
  { name: 'Migration20261202011500_demand_method', class: Migration20261202011500_demand_method },
  { name: 'Migration20261203090000_asset_survey_criteria', class: Migration20261203090000_asset_survey_criteria },
  { name: 'Migration20261203100000_renewal_threshold', class: Migration20261203100000_renewal_threshold },
  { name: 'Migration20261204100000_exactly_once', class: Migration20261204100000_exactly_once },
  { name: 'Migration20261204200000_rate_limit', class: Migration20261204200000_rate_limit },
  { name: 'Migration20261204300000_subscription_unique', class: Migration20261204300000_subscription_unique },
  { name: 'Migration20261204500000_worker_heartbeat', class: Migration20261204500000_worker_heartbeat },
  { name: 'Migration20261204600000_survey_corrections', class: Migration20261204600000_survey_corrections },
  { name: 'Migration20261206600000_attachment_undo', class: Migration20261206600000_attachment_undo },
  { name: 'Migration20261210000000_asset_outlook', class: Migration20261210000000_asset_outlook },
  { name: 'Migration20261211000000_object_storage', class: Migration20261211000000_object_storage },
  { name: 'Migration20261212000000_capture_device_id', class: Migration20261212000000_capture_device_id },
  { name: 'Migration20261214000000_structured_positions', class: Migration20261214000000_structured_positions },
  { name: 'Migration20261216000000_position_parser_version', class: Migration20261216000000_position_parser_version },
  { name: 'Migration20261218000000_reading_device_ids_kept', class: Migration20261218000000_reading_device_ids_kept },
];
