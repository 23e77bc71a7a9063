// Parts of a study file (profiles/study_file.hpp) that every study of a site writes alike:
// the root attributes and the /parameters table.
#pragma once

#include <filesystem>
#include <string>

#include "wetfront/profiles/study_file.hpp"
#include "wetfront/site/adjustable_parameters.hpp"

namespace wetfront::site::detail {

// Root attributes: kind, site, run start, version, input hash, run id, reading uncertainties and
// the recharge plane.
profiles::StudyRecord study_record(const SiteSetup& site, const ParameterStudy& study, const std::string& input_hash,
                                   std::string kind, const std::string& version, const std::string& run_id);

// /parameters: one row per adjustable parameter (name, unit, scale, range, site value).
profiles::StudyTable parameter_table(const ParameterStudy& study);

// profiles::write_study, with a failure as base::InputError naming the file.
void save_study(const std::filesystem::path& path, const profiles::StudyRecord& record);

}  // namespace wetfront::site::detail
