/* site.h - the site file: everything a plan needs, read and validated.
 *
 * Input stage.  site_load() reads the JSON site file (docs/inputs.md), checks
 * every value and cross-reference, loads the named sward parameter sets from
 * the models directory, and fills a `site` that later stages read and never
 * change.  The weather files it names are read separately by weather.c, from
 * the paths and column map kept in `site_weather`.  Units are in the names.
 */
#ifndef SITE_H
#define SITE_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "sward.h"

#define SITE_ID_LEN 48
#define SITE_PATH_LEN 1024
#define SITE_MAX_FILES 64

typedef struct site_location {
    double latitude_deg;   /* -90..90, north positive */
    double longitude_deg;  /* -180..180, east positive */
    double elevation_m;    /* above sea level */
    double utc_offset_h;   /* time base of the weather timestamps, e.g. -7 */
} site_location;

typedef struct site_array {
    double axis_azimuth_deg;   /* direction the axis points, clockwise from north */
    double axis_tilt_deg;      /* axis slope from horizontal */
    double cross_axis_slope_deg; /* ground slope across the rows (backtracking) */
    double pitch_m;            /* row-to-row distance */
    double chord_m;            /* module width across the axis */
    double hub_height_m;       /* axis height above ground */
    double max_rotation_deg;   /* rotation limit either way */
    int backtracking;          /* 1 = backtrack to avoid row-to-row shading */
    double night_angle_deg;    /* angle held while the sun is down */
    double stow_angle_deg;     /* angle in high wind */
    double stow_wind_m_s;      /* wind that triggers stow; 0 = never */
    double strip_width_m;      /* ground strips across the pitch */
    double drip_width_m;       /* band under a drip edge that takes the runoff */
} site_array;

typedef struct site_soil {
    char id[SITE_ID_LEN];
    double water_held_mm_per_m; /* between field capacity and wilting point */
    double rooting_depth_m;
    double infiltration_mm_h;   /* rain beyond this per hour runs off */
    char texture[24];           /* Clapp & Hornberger (1978) class
                                   (lateral.h), "" when not given: then no
                                   sideways flow between strips */
} site_soil;

typedef struct site_sward {
    char id[SITE_ID_LEN];
    sward_params p;
} site_sward;

typedef struct site_paddock {
    char id[SITE_ID_LEN];
    char block[SITE_ID_LEN];  /* O&M block name ("" when not given) */
    double area_ha;
    double array_share;       /* share of the area under the array, 0..1 */
    int soil;                 /* index into site.soils */
    int sward;                /* index into site.swards */
    double start_cover_kgdm_ha; /* measured cover at the plan start, or -1 */
} site_paddock;

enum site_species { SPECIES_SHEEP, SPECIES_CATTLE, SPECIES_GOATS };

typedef struct site_mob {
    char id[SITE_ID_LEN];
    int species;              /* enum site_species */
    int head;
    double liveweight_kg;     /* mean per head */
    double intake_kgdm_d;     /* per head per day (derived from % when given so) */
    double intake_pct_lw;     /* as given, or 0 when intake was given in kg */
} site_mob;

typedef struct site_rules {
    double residual_height_cm;  /* leave at least this much */
    int min_rest_days;
    int max_days_per_visit;
    int ceiling_derived;        /* 1 = from the lowest panel edge */
    double ceiling_height_cm;   /* vegetation ceiling in use */
    double ceiling_margin_cm;   /* safety margin below the lowest edge */
    int share_paddocks;         /* 1 = several mobs may share a paddock */
    double cattle_min_clearance_m; /* cattle barred below this edge height */
    int max_paddocks_per_week;  /* paddocks one mob may use in a week */
    double max_head_per_ha;     /* stocking density while present; 0 = none */
} site_rules;

typedef struct site_costs {
    char currency[8];
    double supplement_per_t_dm;
    double mowing_per_ha;
    double per_move;
} site_costs;

typedef struct site_window {
    int64_t from_day, to_day;  /* inclusive day numbers (tcal.h) */
    int n_paddocks;
    int *paddocks;             /* indices into site.paddocks */
    char reason[128];
    int keep_off_days;         /* stock stay out this many days after to_day too
                                  (herbicide or spray withholding); 0 when not given */
} site_window;

/* Weather columns, in this order everywhere. */
enum wx_col {
    WX_TIME, WX_GHI, WX_TEMP, WX_RH, WX_RAIN, WX_WIND,
    WX_DNI, WX_DHI, WX_PRESSURE, WX_NCOLS
};

typedef struct site_weather {
    int n_files;
    char files[SITE_MAX_FILES][SITE_PATH_LEN]; /* resolved paths */
    char header[WX_NCOLS][64];  /* CSV header naming each column */
    int temp_f;                 /* 1 = temperature in deg F */
    int rain_in;                /* 1 = rain in inches */
    int wind_unit;              /* 0 m/s, 1 km/h, 2 mph */
    int pressure_kpa;           /* 1 = kPa, 0 = hPa (mbar) */
    int max_fill_h;             /* longest gap filled by interpolation */
    int daily;                  /* 1 = daily files, made hourly (wxdaily.c) */
    int rain_rule;              /* daily files: enum wxd_rain_rule */
    site_location loc;          /* copy of the site's, for daily files */
} site_weather;

typedef struct site_plan {
    int64_t start_day;         /* first day of the plan, or INT64_MIN when not given */
    int weeks;                 /* horizon, 1..52 */
    int percentile;            /* growth forecast used: 10, 50 or 90 */
} site_plan;

/* site.units: how outputs show areas and masses (inputs are always metric) */
enum site_units { SITE_UNITS_METRIC, SITE_UNITS_US };

typedef struct site {
    char path[SITE_PATH_LEN];
    char name[128];
    int units;                 /* enum site_units; $.units "metric" (default) or "us" */
    int has_plate;             /* 1: $.plate_meter gives the farm's own plate equation */
    double plate_kgdm_ha_per_cm; /* its a: cover = a x plate height (cm) + b */
    double plate_base_kgdm_ha;   /* its b */
    site_location loc;
    site_array array;
    int n_soils, n_swards, n_paddocks, n_mobs, n_windows;
    site_soil *soils;
    site_sward *swards;
    site_paddock *paddocks;
    site_mob *mobs;
    site_window *windows;
    site_rules rules;
    site_costs costs;
    site_weather weather;
    site_plan plan;
} site;

/* Reads and validates PATH; sward sets come from models_dir/swards/.
 * Returns 0, or -1 with one message line in err (s is then freed). */
int site_load(const char *path, const char *models_dir, site *s, rg_err *err);

/* The same from text already in memory; path names the file in messages
 * and weather paths are relative to its directory. */
int site_parse(const char *path, const char *text, size_t len,
               const char *models_dir, site *s, rg_err *err);

void site_free(site *s);

/* Height above ground of the lowest panel edge at full rotation, m. */
double site_lowest_edge_m(const site_array *a);

/* The flock's daily dry-matter demand, kg DM/day. */
double site_demand_kgdm_d(const site *s);

/* Index of the paddock with this id, or -1. */
int site_find_paddock(const site *s, const char *id);

#endif
