#include "wetfront/site/site_keys.hpp"

#include <algorithm>
#include <cctype>

#include <fmt/format.h>

#include "wetfront/base/did_you_mean.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/base/input_files.hpp"

namespace wetfront::site {

toml::table read_site_document(const std::filesystem::path& site_file) {
  const std::string file = site_file.string();
  std::error_code status;
  if (std::filesystem::is_directory(site_file, status))
    throw base::InputError(file, 0, "", "is a folder, not a site file; give the site file (TOML) in it");
  const std::optional<std::string> bytes = base::read_input_file(site_file);
  if (!bytes) throw base::InputError(file, 0, "", "cannot open the site file (missing or unreadable)");
  try {
    return toml::parse(*bytes, file);
  } catch (const toml::parse_error& error) {
    throw base::InputError(file, error.source().begin.line, "", fmt::format("not valid TOML: {}", error.description()));
  }
}

namespace {

std::string join(std::span<const std::string_view> names) {
  std::string list;
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (i > 0) list += ", ";
    list += names[i];
  }
  return list;
}

std::string lower_trimmed(std::string_view text) {
  std::string out = base::trim(text);
  for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

std::string_view type_name(const toml::node& node) {
  switch (node.type()) {
    case toml::node_type::table: return "a table";
    case toml::node_type::array: return "an array";
    case toml::node_type::string: return "a string";
    case toml::node_type::integer: return "an integer";
    case toml::node_type::floating_point: return "a number";
    case toml::node_type::boolean: return "true/false";
    default: return "a date or time";
  }
}

}  // namespace

SiteTable::SiteTable(const toml::table& table, std::string path, std::string file)
    : table_(&table), path_(std::move(path)), file_(std::move(file)) {}

std::string SiteTable::key_name(std::string_view key) const {
  if (key.empty()) return path_;
  return path_.empty() ? std::string(key) : fmt::format("{}.{}", path_, key);
}

std::size_t SiteTable::line_of(std::string_view key) const {
  if (const toml::node* node = table_->get(key)) {
    if (node->source().begin.line > 0) return node->source().begin.line;
  }
  return table_->source().begin.line;
}

void SiteTable::fail(std::string_view key, const std::string& problem) const {
  const std::string name = key_name(key);
  throw base::InputError(file_, line_of(key), "", name.empty() ? problem : fmt::format("key '{}': {}", name, problem));
}

std::size_t SiteTable::entry_line(std::string_view key, std::size_t index) const {
  if (const toml::array* array = table_->get_as<toml::array>(key)) {
    if (const toml::node* entry = array->get(index); entry != nullptr && entry->source().begin.line > 0) {
      return entry->source().begin.line;
    }
  }
  return line_of(key);
}

void SiteTable::fail_entry(std::string_view key, std::size_t index, const std::string& problem) const {
  throw base::InputError(file_, entry_line(key, index), "", fmt::format("key '{}': {}", key_name(key), problem));
}

void SiteTable::only_keys(std::span<const std::string_view> allowed) const {
  for (auto&& [key, value] : *table_) {
    const std::string_view name = key.str();
    if (std::find(allowed.begin(), allowed.end(), name) != allowed.end()) continue;
    std::string message = fmt::format("unknown key '{}'", key_name(name));
    if (const auto near = base::did_you_mean(name, allowed)) {
      message += fmt::format("; did you mean '{}'? Allowed here: {}", *near, join(allowed));
    } else {
      message += fmt::format(". Allowed here: {}", join(allowed));
    }
    const std::size_t line = key.source().begin.line > 0 ? key.source().begin.line : value.source().begin.line;
    throw base::InputError(file_, line, "", message);
  }
}

const toml::node& SiteTable::require(std::string_view key) const {
  const toml::node* node = table_->get(key);
  if (node == nullptr) {
    const std::string where = path_.empty() ? "at the top of the file" : fmt::format("in [{}]", path_);
    throw base::InputError(file_, table_->source().begin.line, "",
                           fmt::format("missing key '{}' {}", key_name(key), where));
  }
  return *node;
}

std::string SiteTable::text(std::string_view key) const {
  const toml::node& node = require(key);
  if (const auto value = node.value<std::string>(); value && node.is_string()) return *value;
  fail(key, fmt::format("expected a string in quotes, got {}", type_name(node)));
}

std::optional<std::string> SiteTable::optional_text(std::string_view key) const {
  if (!has(key)) return std::nullopt;
  return text(key);
}

double SiteTable::quantity_of(const toml::node& node, std::string_view key, std::size_t index,
                              base::Dimension dimension) const {
  const std::string what = index == 0 ? std::string("value") : fmt::format("entry {}", index);
  if (node.is_integer() || node.is_floating_point()) {
    fail(key, fmt::format("{} {} is a bare number; write it as a string with a unit, one of {} (e.g. \"{} {}\")", what,
                          node.value<double>().value_or(0.0), base::accepted_units(dimension),
                          node.value<double>().value_or(0.0), base::internal_unit(dimension)));
  }
  if (!node.is_string()) {
    fail(key, fmt::format("expected a number with a unit in quotes ({}), got {}", base::accepted_units(dimension),
                          type_name(node)));
  }
  try {
    return base::parse_quantity(*node.value<std::string>(), dimension, what);
  } catch (const base::InputError& error) {
    const std::size_t line = node.source().begin.line > 0 ? node.source().begin.line : line_of(key);
    throw base::InputError(file_, line, "", fmt::format("key '{}': {}", key_name(key), error.what()));
  }
}

double SiteTable::quantity(std::string_view key, base::Dimension dimension) const {
  return quantity_of(require(key), key, 0, dimension);
}

std::optional<double> SiteTable::optional_quantity(std::string_view key, base::Dimension dimension) const {
  if (!has(key)) return std::nullopt;
  return quantity(key, dimension);
}

double SiteTable::number(std::string_view key) const {
  const toml::node& node = require(key);
  if (node.is_integer() || node.is_floating_point()) return *node.value<double>();
  if (node.is_string()) {
    try {
      return base::parse_number(*node.value<std::string>(), "value");
    } catch (const base::InputError&) {
      fail(key, fmt::format("expected a plain number without a unit, got '{}'", *node.value<std::string>()));
    }
  }
  fail(key, fmt::format("expected a plain number, got {}", type_name(node)));
}

std::optional<double> SiteTable::optional_number(std::string_view key) const {
  if (!has(key)) return std::nullopt;
  return number(key);
}

std::optional<double> SiteTable::optional_number_if_plain(std::string_view key) const {
  const toml::node* node = table_->get(key);
  if (node == nullptr || !(node->is_integer() || node->is_floating_point())) return std::nullopt;
  return node->value<double>();
}

std::vector<std::string> SiteTable::text_list(std::string_view key) const {
  const toml::node& node = require(key);
  const toml::array* array = node.as_array();
  if (array == nullptr) fail(key, fmt::format("expected an array of strings [\"...\", ...], got {}", type_name(node)));
  std::vector<std::string> out;
  for (const auto& item : *array) {
    if (!item.is_string())
      fail(key, fmt::format("entry {} is {}; expected a string in quotes", out.size() + 1, type_name(item)));
    out.push_back(*item.value<std::string>());
  }
  return out;
}

std::vector<double> SiteTable::quantity_list(std::string_view key, base::Dimension dimension) const {
  const toml::node& node = require(key);
  const toml::array* array = node.as_array();
  if (array == nullptr) {
    fail(key, fmt::format("expected an array of values with units, e.g. [\"10 {0}\", \"20 {0}\"], got {1}",
                          base::internal_unit(dimension), type_name(node)));
  }
  std::vector<double> out;
  for (const auto& item : *array) out.push_back(quantity_of(item, key, out.size() + 1, dimension));
  return out;
}

std::vector<double> SiteTable::number_list(std::string_view key) const {
  const toml::node& node = require(key);
  const toml::array* array = node.as_array();
  if (array == nullptr) fail(key, fmt::format("expected an array of numbers, got {}", type_name(node)));
  std::vector<double> out;
  for (const auto& item : *array) {
    if (!item.is_integer() && !item.is_floating_point()) {
      fail(key, fmt::format("entry {} is {}; expected a plain number", out.size() + 1, type_name(item)));
    }
    out.push_back(*item.value<double>());
  }
  return out;
}

std::string SiteTable::choice(std::string_view key, std::span<const std::string_view> choices) const {
  const std::string value = lower_trimmed(text(key));
  if (std::find(choices.begin(), choices.end(), value) != choices.end()) return value;
  std::string message = fmt::format("'{}' is not one of: {}", value, join(choices));
  if (const auto near = base::did_you_mean(value, choices)) message += fmt::format("; did you mean '{}'?", *near);
  fail(key, message);
}

std::optional<std::string> SiteTable::optional_choice(std::string_view key,
                                                      std::span<const std::string_view> choices) const {
  if (!has(key)) return std::nullopt;
  return choice(key, choices);
}

std::optional<SiteTable> SiteTable::subtable(std::string_view key) const {
  const toml::node* node = table_->get(key);
  if (node == nullptr) return std::nullopt;
  if (const toml::table* table = node->as_table()) return SiteTable(*table, key_name(key), file_);
  fail(key, fmt::format("expected a table [{}], got {}", key_name(key), type_name(*node)));
}

std::vector<SiteTable> SiteTable::table_array(std::string_view key) const {
  std::vector<SiteTable> out;
  const toml::node* node = table_->get(key);
  if (node == nullptr) return out;
  const toml::array* array = node->as_array();
  if (array == nullptr)
    fail(key, fmt::format("expected one or more [[{}]] tables, got {}", key_name(key), type_name(*node)));
  for (const auto& item : *array) {
    const toml::table* table = item.as_table();
    if (table == nullptr)
      fail(key, fmt::format("entry {} is {}; expected a [[{}]] table", out.size() + 1, type_name(item), key));
    out.emplace_back(*table, fmt::format("{}[{}]", key_name(key), out.size() + 1), file_);
  }
  return out;
}

}  // namespace wetfront::site
