// Forwarding header for bench/ (see site/CMakeLists.txt): use "wetfront/site/season_setup.hpp".
#pragma once

#include "wetfront/site/season_setup.hpp"

namespace wetfront::cli {
using namespace wetfront::site;
}  // namespace wetfront::cli
