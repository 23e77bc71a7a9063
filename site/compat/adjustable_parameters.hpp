// Forwarding header for bench/ (see site/CMakeLists.txt): use "wetfront/site/adjustable_parameters.hpp".
#pragma once

#include "wetfront/site/adjustable_parameters.hpp"

namespace wetfront::cli {
using namespace wetfront::site;
}  // namespace wetfront::cli
