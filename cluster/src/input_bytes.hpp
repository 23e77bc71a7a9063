// The leader's input files as one message, and back.
#pragma once

#include <string>
#include <string_view>

#include "wetfront/base/input_files.hpp"

namespace wetfront::cluster {

std::string encode_inputs(const base::InputFileBytes& files);
base::InputFileBytes decode_inputs(std::string_view bytes);

}  // namespace wetfront::cluster
