#include "scored_run_bytes.hpp"

#include "wetfront/studies/task_bytes.hpp"

namespace wetfront::site {
namespace {

using studies::ByteReader;
using studies::ByteWriter;

void write_metrics(ByteWriter& out, const observations::FitMetrics& m) {
  out.number(m.count);
  for (const double v : {m.bias, m.root_mean_square_error, m.nash_sutcliffe, m.kling_gupta, m.correlation,
                         m.variability_ratio, m.mean_ratio})
    out.number(v);
}

observations::FitMetrics read_metrics(ByteReader& in) {
  observations::FitMetrics m;
  m.count = in.number<int>();
  for (double* v : {&m.bias, &m.root_mean_square_error, &m.nash_sutcliffe, &m.kling_gupta, &m.correlation,
                    &m.variability_ratio, &m.mean_ratio})
    *v = in.number<double>();
  return m;
}

}  // namespace

std::string encode_parameter_set(const studies::ParameterSet& values) {
  ByteWriter out;
  out.numbers(values);
  return out.take();
}

studies::ParameterSet decode_parameter_set(std::string_view bytes) {
  ByteReader in(bytes);
  return in.numbers();
}

std::string encode_scored_run(const ScoredRun& run) {
  ByteWriter out;
  out.numbers(run.values);
  out.number<std::uint8_t>(run.complete ? 1 : 0);
  out.text(run.failure);
  out.numbers(run.residuals);
  out.number(run.objective);
  write_metrics(out, run.heads);
  out.number<std::uint8_t>(run.water_contents ? 1 : 0);
  if (run.water_contents) write_metrics(out, *run.water_contents);
  out.number(run.season_recharge_cm);
  out.numbers(run.visit_recharge_cm);
  return out.take();
}

ScoredRun decode_scored_run(std::string_view bytes) {
  ByteReader in(bytes);
  ScoredRun run;
  run.values = in.numbers();
  run.complete = in.number<std::uint8_t>() != 0;
  run.failure = in.text();
  const std::vector<double> residuals = in.numbers();
  run.residuals = Eigen::Map<const Eigen::VectorXd>(residuals.data(), static_cast<Eigen::Index>(residuals.size()));
  run.objective = in.number<double>();
  run.heads = read_metrics(in);
  if (in.number<std::uint8_t>() != 0) run.water_contents = read_metrics(in);
  run.season_recharge_cm = in.number<double>();
  run.visit_recharge_cm = in.numbers();
  return run;
}

}  // namespace wetfront::site
