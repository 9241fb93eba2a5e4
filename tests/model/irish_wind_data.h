// The open Irish daily-wind data set in tests/data/irish-daily-wind (source
// and check values in its README), read with plain code of the test's own so
// that the checks do not depend on fillcast's CSV reader.
#ifndef FILLCAST_TESTS_MODEL_IRISH_WIND_DATA_H_
#define FILLCAST_TESTS_MODEL_IRISH_WIND_DATA_H_

#include <cstdlib>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

namespace irish_wind {

// 1 knot = 1852 m / 3600 s, exact by definition.
inline constexpr double kMsPerKnot = 1852.0 / 3600.0;

inline std::string DataDir() {
  return std::string(FILLCAST_SOURCE_DIR) + "/tests/data/irish-daily-wind";
}
inline std::string SpeedsFile() { return DataDir() + "/daily_mean_wind_knots.csv"; }

struct Station {
  std::string code;
  double published_mean_ms = 0.0;  // MeanWind of stations.csv
};

inline std::vector<std::string> Cells(const std::string& line) {
  std::vector<std::string> cells;
  std::stringstream in(line);
  std::string cell;
  while (std::getline(in, cell, ',')) {
    if (cell.size() >= 2 && cell.front() == '"') cell = cell.substr(1, cell.size() - 2);
    cells.push_back(cell);
  }
  return cells;
}

// stations.csv: "Station","Code","Latitude","Longitude","MeanWind". The
// Latitude of one station holds '""' quotes but no comma, so a plain split
// keeps the columns in place.
inline std::vector<Station> Stations() {
  std::ifstream in(DataDir() + "/stations.csv");
  std::string line;
  std::getline(in, line);
  std::vector<Station> out;
  while (std::getline(in, line)) {
    const std::vector<std::string> c = Cells(line);
    if (c.size() == 5) out.push_back(Station{c[1], std::strtod(c[4].c_str(), nullptr)});
  }
  return out;
}

// One station's daily means in m/s, all 6,574 days (read once per station).
inline std::vector<double> SpeedsMs(const std::string& code) {
  static std::map<std::string, std::vector<double>> cache;
  const auto hit = cache.find(code);
  if (hit != cache.end()) return hit->second;
  std::ifstream in(SpeedsFile());
  std::string line;
  std::getline(in, line);
  const std::vector<std::string> header = Cells(line);
  std::size_t col = 0;
  while (col < header.size() && header[col] != code) ++col;
  std::vector<double> out;
  while (std::getline(in, line)) {
    const std::vector<std::string> c = Cells(line);
    if (col < c.size()) out.push_back(std::strtod(c[col].c_str(), nullptr) * kMsPerKnot);
  }
  cache[code] = out;
  return out;
}

// Month (1-12) and day of each row, in file order (from the date column).
struct MonthDay {
  int month = 1, day = 1;
};
inline std::vector<MonthDay> Dates() {
  std::ifstream in(SpeedsFile());
  std::string line;
  std::getline(in, line);
  std::vector<MonthDay> out;
  while (std::getline(in, line)) {
    const std::string date = Cells(line).at(0);  // YYYY-MM-DD
    out.push_back({std::atoi(date.substr(5, 2).c_str()), std::atoi(date.substr(8, 2).c_str())});
  }
  return out;
}

}  // namespace irish_wind

#endif  // FILLCAST_TESTS_MODEL_IRISH_WIND_DATA_H_
