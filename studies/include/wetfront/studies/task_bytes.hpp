// Requests and results of a TaskRunner as bytes: numbers in the machine's own representation
// (every rank of a study runs the same binary on the same kind of machine), so a value read
// back is the value written, bit for bit.
#pragma once

#include <cstdint>
#include <cstring>
#include <stdexcept>
#include <string>
#include <string_view>
#include <type_traits>
#include <vector>

namespace wetfront::studies {

class ByteWriter {
 public:
  template <class T>
    requires std::is_arithmetic_v<T>
  void number(T value) {
    bytes_.append(reinterpret_cast<const char*>(&value), sizeof value);
  }
  void text(std::string_view value) {
    number<std::uint64_t>(value.size());
    bytes_.append(value);
  }
  template <class Range>
  void numbers(const Range& values) {
    number<std::uint64_t>(static_cast<std::uint64_t>(values.size()));
    for (const double v : values) number(v);
  }
  std::string take() { return std::move(bytes_); }

 private:
  std::string bytes_;
};

class ByteReader {
 public:
  explicit ByteReader(std::string_view bytes) : bytes_(bytes) {}
  template <class T>
    requires std::is_arithmetic_v<T>
  T number() {
    T value;
    std::memcpy(&value, take(sizeof value).data(), sizeof value);
    return value;
  }
  std::string text() { return std::string(take(number<std::uint64_t>())); }
  std::vector<double> numbers() {
    std::vector<double> values(number<std::uint64_t>());
    for (double& v : values) v = number<double>();
    return values;
  }

 private:
  std::string_view take(std::size_t count) {
    if (count > bytes_.size()) throw std::runtime_error("task bytes: a message ends early");
    const std::string_view part = bytes_.substr(0, count);
    bytes_.remove_prefix(count);
    return part;
  }
  std::string_view bytes_;
};

}  // namespace wetfront::studies
