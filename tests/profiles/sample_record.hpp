// A synthetic run record built by hand (no solver): an invented 100 cm loam column over
// 30 days with a wetting front moving down, for the file tests and the plotting smoke test.
#pragma once

#include "wetfront/profiles/run_record.hpp"

namespace wetfront::profiles::testing {

// complete = true, 20 cells, daily output days 0..30, visits on days 7, 14 and 21.
RunRecord sample_record();

// The same column, stopped at day 12.5 with a recorded failure.
RunRecord sample_failed_record();

}  // namespace wetfront::profiles::testing
