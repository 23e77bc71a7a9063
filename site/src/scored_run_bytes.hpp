// A parameter set (a task's request) and its scored run (the task's result) as bytes for a
// studies::TaskRunner; decode(encode(x)) == x bit for bit.
#pragma once

#include <string>
#include <string_view>

#include "wetfront/site/parameter_runs.hpp"

namespace wetfront::site {

std::string encode_parameter_set(const studies::ParameterSet& values);
studies::ParameterSet decode_parameter_set(std::string_view bytes);

std::string encode_scored_run(const ScoredRun& run);
ScoredRun decode_scored_run(std::string_view bytes);

}  // namespace wetfront::site
