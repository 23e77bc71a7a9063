// Forwarding header for bench/ (see site/CMakeLists.txt): use "wetfront/site/parameter_study.hpp".
#pragma once

#include "wetfront/site/parameter_study.hpp"

namespace wetfront::cli {
using namespace wetfront::site;
}  // namespace wetfront::cli
