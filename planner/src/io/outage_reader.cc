#include "io/outage_reader.h"

#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include "io/plan_fields.h"

namespace planner {
namespace io {
namespace {

const std::vector<std::string> kOutagesFields = {
    "turbine",  "data_acquisition", "planned", "episodes", "channel_groups",
    "parked_counts_during_outage"};
const std::vector<std::string> kChannelGroupFields = {
    "name",         "mtbf_h",         "mttr_h",
    "up_times",     "repair_times",   "repair_month_factors",
    "recalibration"};
const std::vector<std::string> kRecalibrationFields = {"hours", "below_ms", "crew"};
const Limits kRecalibrationHoursLimits = Interval("(]", 0, 24 * 14, "h");
const Limits kRecalibrationWindLimits = Interval("(]", 0, 50, "m/s");
const std::vector<std::string> kEpisodeFields = {"name", "starts_per_month", "mean_h",
                                                 "durations", "effect"};
const Limits kEpisodeMeanLimits = Interval("(]", 0, 24 * 60, "h");
// A month holds about 30 days; more starts than days in a month are a slip.
const Limits kStartsPerMonthLimits = Interval("[]", 0, 30);
const std::vector<std::string> kOutageModelFields = {
    "mtbf_h", "mttr_h", "up_times", "repair_times", "repair_month_factors"};
const std::vector<std::string> kLawFields = {"law", "k", "scale_h", "sigma", "mu"};
const std::vector<std::string> kExponentialFields = {"law"};
const std::vector<std::string> kWeibullFields = {"law", "k", "scale_h"};
const std::vector<std::string> kLognormalFields = {"law", "sigma", "mu"};
const std::vector<std::string> kPlannedFields = {"name", "from", "to", "turbine",
                                                 "data_acquisition"};

constexpr size_t kMaxEpisodes = 8;
const Limits kUpMeanLimits = Interval("[]", 0, 1e6, "h");
const Limits kRepairMeanLimits = Interval("[]", 0, 1e5, "h");

// A duration law as written, before its mean is known.
struct LawInput {
  DurationLaw law;
  // The law's own scale (Weibull scale_h, lognormal mu), if given, and the
  // mean it implies.
  std::optional<Field> scale_field;
  double mean_h = 0.0;
};

LawInput ReadLaw(const Field& f) {
  const std::string peeked = PeekText(f, "law");
  const bool known =
      peeked == "exponential" || peeked == "weibull" || peeked == "lognormal";
  const FieldMap m(f,
                   peeked == "exponential" ? kExponentialFields
                   : peeked == "weibull"   ? kWeibullFields
                   : peeked == "lognormal" ? kLognormalFields
                                           : kLawFields,
                   known ? "for law '" + peeked + "'" : "");
  const Field law_field = m.Get("law");
  const std::string name = AsText(law_field);
  LawInput in;
  if (name == "exponential") {
    in.law.kind = DurationLaw::Kind::kExponential;
  } else if (name == "weibull") {
    in.law.kind = DurationLaw::Kind::kWeibull;
    in.law.shape = ReadNumber(m, "k", Interval("[]", 0.1, 10));
    in.scale_field = m.Find("scale_h");
    if (in.scale_field) {
      const double scale = AsNumber(*in.scale_field, Interval("()", 0, kInfinity, "h"));
      in.mean_h = scale * std::tgamma(1.0 + 1.0 / in.law.shape);
    }
  } else if (name == "lognormal") {
    in.law.kind = DurationLaw::Kind::kLognormal;
    in.law.shape = ReadNumber(m, "sigma", Interval("(]", 0, 4));
    in.scale_field = m.Find("mu");
    if (in.scale_field) {
      const double mu = AsNumber(*in.scale_field, Interval("[]", -20, 20));
      in.mean_h = std::exp(mu + in.law.shape * in.law.shape / 2.0);
    }
  } else {
    Fail(law_field, Describe(law_field.node) +
                        " is not a law; valid: exponential, weibull, lognormal");
  }
  return in;
}

// The mean duration: `mean_key` (mtbf_h / mttr_h) or the law's own scale.
double ReadMean(const FieldMap& m, const std::string& mean_key,
                const std::string& law_key, const LawInput& law, const Limits& limits,
                const std::string& what) {
  const std::optional<Field> mean = m.Find(mean_key);
  if (law.scale_field) {
    const std::string scale = law.scale_field->path.substr(m.self().path.size() + 1);
    if (mean) {
      Fail(*mean, "given together with " + scale + "; give either the mean (" + mean_key +
                      ") or the law's own scale, not both");
    }
    if (!Within(limits, law.mean_h)) {
      Fail(*law.scale_field, "gives a mean " + what + " of " + FormatNumber(law.mean_h) +
                                 " h; must be " + DescribeLimits(limits));
    }
    return law.mean_h;
  }
  if (!mean) {
    ThrowAt(m.self().where, m.PathOf(mean_key),
            "required field is missing; give the mean " + what + ", or " + law_key +
                " with the law's own scale (scale_h for weibull, mu for lognormal)");
  }
  return AsNumber(*mean, limits);
}

void ReadRepairMonthFactors(const Field& f, OutageModel* model) {
  const std::vector<Field> items = AsList(f);
  if (items.size() != 12) {
    Fail(f, std::to_string(items.size()) +
                " values given; expected 12 (January to December)");
  }
  for (int i = 0; i < 12; ++i) {
    model->repair_month_factors[i] = AsNumber(items[i], Interval("(]", 0, 10));
  }
}

OutageModel ReadOutageModelFields(const FieldMap& m) {
  OutageModel model;
  LawInput up;
  LawInput repair;
  if (const auto law = m.Find("up_times")) up = ReadLaw(*law);
  if (const auto law = m.Find("repair_times")) repair = ReadLaw(*law);
  model.up_law = up.law;
  model.repair_law = repair.law;
  model.mtbf_h = ReadMean(m, "mtbf_h", "up_times", up, kUpMeanLimits, "up time");
  model.mttr_h =
      ReadMean(m, "mttr_h", "repair_times", repair, kRepairMeanLimits, "repair time");
  if (model.mtbf_h > 0.0 && model.mttr_h == 0.0) {
    const Field mttr = m.Get("mttr_h");  // a law's own scale never gives 0
    Fail(mttr, Text(mttr) +
                   " must be above 0 when mtbf_h is above 0 (a repair "
                   "takes time); set mtbf_h to 0 for no outages");
  }
  if (const auto factors = m.Find("repair_month_factors")) {
    ReadRepairMonthFactors(*factors, &model);
  }
  return model;
}

OutageModel ReadOutageModel(const Field& f) {
  return ReadOutageModelFields(FieldMap(f, kOutageModelFields));
}

Recalibration ReadRecalibration(const Field& f) {
  const FieldMap m(f, kRecalibrationFields);
  Recalibration r;
  r.needed = true;
  r.hours = ReadNumber(m, "hours", kRecalibrationHoursLimits);
  r.below_ms = ReadNumber(m, "below_ms", kRecalibrationWindLimits);
  r.crew = ReadBool(m, "crew", true);
  return r;
}

ChannelGroup ReadChannelGroup(const Field& f, NameSet* names) {
  const FieldMap m(f, kChannelGroupFields);
  ChannelGroup g;
  g.name = names->Read(m);
  g.failures = ReadOutageModelFields(m);
  if (g.failures.mtbf_h == 0.0) {
    Fail(m.Get("mtbf_h"), Text(m.Get("mtbf_h")) +
                              " means the group never fails, so it changes nothing; "
                              "give its mean up time above 0, or remove the group");
  }
  if (const auto r = m.Find("recalibration")) g.recalibration = ReadRecalibration(*r);
  return g;
}

PlannedOutage ReadPlannedOutage(const Field& f, NameSet* names) {
  const FieldMap m(f, kPlannedFields);
  PlannedOutage outage;
  outage.name = names->Read(m);
  outage.from = AsDate(m.Get("from"));
  const Field to = m.Get("to");
  outage.to = AsDate(to);
  if (DaysBetween(outage.from, outage.to) <= 0) {
    Fail(to, Text(to) + " is not after from (" + FormatDate(outage.from) +
                 "); the outage runs from 00:00 of from to 00:00 of to (exclusive)");
  }
  outage.turbine = ReadBool(m, "turbine", true);
  outage.daq = ReadBool(m, "data_acquisition", false);
  if (!outage.turbine && !outage.daq) {
    Fail(f,
         "takes neither the turbine nor the data acquisition out of service; set "
         "turbine or data_acquisition to true");
  }
  return outage;
}

void ReadEffect(const Field& f, EpisodeModel* e) {
  const std::string effect = AsText(f);
  e->stops_turbine = effect == "stop" || effect == "both";
  e->invalidates_records = effect == "invalid" || effect == "both";
  if (e->stops_turbine || e->invalidates_records) return;
  Fail(f, Describe(f.node) + " is not an effect; valid: stop (the turbine stops), "
                             "invalid (its records do not count), both");
}

EpisodeModel ReadEpisode(const Field& f, NameSet* names) {
  const FieldMap m(f, kEpisodeFields);
  EpisodeModel e;
  e.name = names->Read(m);
  const Field starts = m.Get("starts_per_month");
  const std::vector<Field> items = AsList(starts);
  if (items.size() != 12) {
    Fail(starts, std::to_string(items.size()) +
                     " values given; expected 12 (January to December)");
  }
  double total = 0.0;
  for (int i = 0; i < 12; ++i) {
    e.starts_per_month[i] = AsNumber(items[i], kStartsPerMonthLimits);
    total += e.starts_per_month[i];
  }
  if (total == 0.0) {
    Fail(starts, "is 0 in every month, so the episode never happens; give the mean "
                 "number of starts in the months it happens, or remove the episode");
  }
  LawInput law;
  if (const auto d = m.Find("durations")) law = ReadLaw(*d);
  e.duration_law = law.law;
  e.mean_h = ReadMean(m, "mean_h", "durations", law, kEpisodeMeanLimits, "duration");
  ReadEffect(m.Get("effect"), &e);
  return e;
}

}  // namespace

void ReadOutages(const Field& f, Plan* plan) {
  const FieldMap m(f, kOutagesFields);
  if (const auto t = m.Find("turbine")) plan->turbine_outages = ReadOutageModel(*t);
  if (const auto d = m.Find("data_acquisition")) plan->daq_outages = ReadOutageModel(*d);
  const std::string or_leave_out = ", or leave the field out";
  if (const auto p = m.Find("planned")) {
    plan->planned_outages = ReadNamedItems<PlannedOutage>(
        *p, "planned outage", 0, or_leave_out, ReadPlannedOutage);
  }
  if (const auto p = m.Find("episodes")) {
    plan->episodes =
        ReadNamedItems<EpisodeModel>(*p, "episode", kMaxEpisodes, or_leave_out, ReadEpisode);
  }
  if (const auto p = m.Find("channel_groups")) {
    plan->channel_groups = ReadNamedItems<ChannelGroup>(
        *p, "channel group", kMaxChannelGroups, or_leave_out, ReadChannelGroup);
  }
  plan->parked_counts_during_outage = ReadBool(m, "parked_counts_during_outage", false);
}

}  // namespace io
}  // namespace planner
