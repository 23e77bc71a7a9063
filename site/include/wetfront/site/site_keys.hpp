// Reading one TOML table of a site file: every key checked against the allowed ones, every
// value read with its unit, and every error naming the file, line and key.
#pragma once

#include <filesystem>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include <toml++/toml.h>

#include "wetfront/base/quantity.hpp"

namespace wetfront::site {

// The parsed TOML document of a site file. Throws base::InputError naming the file (and the line of
// a syntax error) when it cannot be opened or is not valid TOML.
toml::table read_site_document(const std::filesystem::path& site_file);

// A table of the site file together with where it came from, for messages.
class SiteTable {
 public:
  // path: e.g. "layers[2]" (empty for the root table); file: the site file as given.
  SiteTable(const toml::table& table, std::string path, std::string file);

  // Throws base::InputError for the first key not in `allowed`, listing the allowed keys and a
  // near miss when there is one.
  void only_keys(std::span<const std::string_view> allowed) const;

  bool has(std::string_view key) const { return table_->contains(key); }
  // Full key name for messages: "layers[2].bottom".
  std::string key_name(std::string_view key) const;
  // Line of the key (or of the table when the key is absent); 0 when unknown.
  std::size_t line_of(std::string_view key) const;
  const std::string& file() const { return file_; }

  // Line of entry `index` (0-based) of the array under `key`; the key's line when unknown.
  std::size_t entry_line(std::string_view key, std::size_t index) const;

  // Throws base::InputError naming file, line and key with `problem`.
  [[noreturn]] void fail(std::string_view key, const std::string& problem) const;
  // The same, for entry `index` (0-based) of the array under `key`, at that entry's line.
  [[noreturn]] void fail_entry(std::string_view key, std::size_t index, const std::string& problem) const;

  // A required value (throws when missing) or an optional one.
  std::string text(std::string_view key) const;
  std::optional<std::string> optional_text(std::string_view key) const;
  // Dimensional value written "<number> <unit>"; a bare number is an error listing the units.
  double quantity(std::string_view key, base::Dimension dimension) const;
  std::optional<double> optional_quantity(std::string_view key, base::Dimension dimension) const;
  // Dimensionless number (integer or float in TOML, or a string holding one).
  double number(std::string_view key) const;
  std::optional<double> optional_number(std::string_view key) const;
  // The value when it is a bare TOML number (integer or float); empty otherwise.
  std::optional<double> optional_number_if_plain(std::string_view key) const;
  // Arrays.
  std::vector<std::string> text_list(std::string_view key) const;
  std::vector<double> quantity_list(std::string_view key, base::Dimension dimension) const;
  std::vector<double> number_list(std::string_view key) const;
  // One of `choices` (exact after trimming and lower-casing); otherwise lists them.
  std::string choice(std::string_view key, std::span<const std::string_view> choices) const;
  std::optional<std::string> optional_choice(std::string_view key, std::span<const std::string_view> choices) const;

  std::optional<SiteTable> subtable(std::string_view key) const;
  std::vector<SiteTable> table_array(std::string_view key) const;

 private:
  const toml::node& require(std::string_view key) const;
  double quantity_of(const toml::node& node, std::string_view key, std::size_t index, base::Dimension dimension) const;

  const toml::table* table_;
  std::string path_;
  std::string file_;
};

}  // namespace wetfront::site
