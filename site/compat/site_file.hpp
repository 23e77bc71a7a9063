// Forwarding header for bench/ (see site/CMakeLists.txt): use "wetfront/site/site_file.hpp".
#pragma once

#include "wetfront/site/site_file.hpp"

namespace wetfront::cli {
using namespace wetfront::site;
}  // namespace wetfront::cli
