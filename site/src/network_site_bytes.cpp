// encode_network_site / decode_network_site (network.hpp).
#include <cstdint>

#include "wetfront/site/network.hpp"
#include "wetfront/studies/task_bytes.hpp"

namespace wetfront::site {
namespace {

using studies::ByteReader;
using studies::ByteWriter;

void write_optional(ByteWriter& out, const std::optional<double>& value) {
  out.number<std::uint8_t>(value ? 1 : 0);
  if (value) out.number(*value);
}

std::optional<double> read_optional(ByteReader& in) {
  if (in.number<std::uint8_t>() == 0) return std::nullopt;
  return in.number<double>();
}

}  // namespace

std::string encode_network_site(const NetworkSite& s) {
  ByteWriter out;
  out.text(s.site_file.string());
  out.text(s.name);
  out.number(static_cast<std::int32_t>(s.status));
  for (const std::string* text : {&s.reason, &s.run_start, &s.run_end, &s.input_hash}) out.text(*text);
  for (const double v : {s.plane_depth_cm, s.water_input_cm, s.runoff_cm, s.evaporation_cm, s.transpiration_cm,
                         s.storage_change_cm, s.drainage_cm, s.bottom_flux_cm})
    out.number(v);
  for (const auto* v : {&s.darcy_cm, &s.water_table_cm}) write_optional(out, *v);
  out.number(s.head_readings);
  for (const auto* v : {&s.head_rmse_cm, &s.head_bias_cm}) write_optional(out, *v);
  out.number<std::uint64_t>(s.intervals.size());
  for (const auto& i : s.intervals) {
    out.text(i.start_date);
    out.text(i.end_date);
    for (const double v : {i.start_day, i.end_day, i.drainage_cm}) out.number(v);
    write_optional(out, i.darcy_cm);
    write_optional(out, i.water_table_cm);
  }
  return out.take();
}

NetworkSite decode_network_site(std::string_view bytes) {
  ByteReader in(bytes);
  NetworkSite s;
  s.site_file = in.text();
  s.name = in.text();
  s.status = static_cast<SiteStatus>(in.number<std::int32_t>());
  for (std::string* text : {&s.reason, &s.run_start, &s.run_end, &s.input_hash}) *text = in.text();
  for (double* v : {&s.plane_depth_cm, &s.water_input_cm, &s.runoff_cm, &s.evaporation_cm, &s.transpiration_cm,
                    &s.storage_change_cm, &s.drainage_cm, &s.bottom_flux_cm})
    *v = in.number<double>();
  for (auto* v : {&s.darcy_cm, &s.water_table_cm}) *v = read_optional(in);
  s.head_readings = in.number<int>();
  for (auto* v : {&s.head_rmse_cm, &s.head_bias_cm}) *v = read_optional(in);
  s.intervals.resize(in.number<std::uint64_t>());
  for (auto& i : s.intervals) {
    i.start_date = in.text();
    i.end_date = in.text();
    for (double* v : {&i.start_day, &i.end_day, &i.drainage_cm}) *v = in.number<double>();
    i.darcy_cm = read_optional(in);
    i.water_table_cm = read_optional(in);
  }
  return s;
}

}  // namespace wetfront::site
