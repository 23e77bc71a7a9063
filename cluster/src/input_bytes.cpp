#include "input_bytes.hpp"

#include <cstdint>

#include "wetfront/studies/task_bytes.hpp"

namespace wetfront::cluster {

std::string encode_inputs(const base::InputFileBytes& files) {
  studies::ByteWriter out;
  out.number<std::uint64_t>(files.size());
  for (const auto& [path, bytes] : files) {
    out.text(path);
    out.number<std::uint8_t>(bytes ? 1 : 0);
    if (bytes) out.text(*bytes);
  }
  return out.take();
}

base::InputFileBytes decode_inputs(std::string_view bytes) {
  studies::ByteReader in(bytes);
  base::InputFileBytes files;
  const auto count = in.number<std::uint64_t>();
  for (std::uint64_t k = 0; k < count; ++k) {
    std::string path = in.text();
    std::optional<std::string> contents;
    if (in.number<std::uint8_t>() != 0) contents = in.text();
    files.emplace(std::move(path), std::move(contents));
  }
  return files;
}

}  // namespace wetfront::cluster
