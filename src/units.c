/* units.c - output units (see units.h for the definitions and their source). */
#include "units.h"

#include <string.h>

static int us(int units)
{
    return units == SITE_UNITS_US;
}

double un_area(int units, double ha)
{
    return us(units) ? ha * 10000.0 / UN_M2_PER_ACRE : ha;
}

double un_cover(int units, double kgdm_ha)
{
    /* kg/ha -> lb/ac: divide by kg per lb, multiply by ha per acre */
    return us(units) ? kgdm_ha / UN_KG_PER_LB * (UN_M2_PER_ACRE / 10000.0) : kgdm_ha;
}

double un_mass(int units, double t)
{
    return us(units) ? t * 1000.0 / UN_KG_PER_LB / 2000.0 : t;
}

double un_height(int units, double cm)
{
    return us(units) ? cm / UN_CM_PER_IN : cm;
}

double un_per_area_cost(int units, double per_ha)
{
    return us(units) ? per_ha * (UN_M2_PER_ACRE / 10000.0) : per_ha;
}

double un_length(int units, double m)
{
    return us(units) ? m / UN_M_PER_FT : m;
}

double un_weight(int units, double kg)
{
    return us(units) ? kg / UN_KG_PER_LB : kg;
}

double un_depth(int units, double mm)
{
    return us(units) ? mm / (10.0 * UN_CM_PER_IN) : mm;
}

/* NIST SP 811 (2008) 4.2.1.1: t/degF = 1.8 t/degC + 32, exact */
double un_temp(int units, double c)
{
    return us(units) ? 1.8 * c + 32.0 : c;
}

const char *un_area_name(int units) { return us(units) ? "ac" : "ha"; }
const char *un_cover_name(int units) { return us(units) ? "lb DM/ac" : "kg DM/ha"; }
const char *un_mass_name(int units) { return us(units) ? "tons DM" : "t DM"; }
const char *un_height_name(int units) { return us(units) ? "in" : "cm"; }
const char *un_length_name(int units) { return us(units) ? "ft" : "m"; }
const char *un_weight_name(int units) { return us(units) ? "lb" : "kg"; }
const char *un_depth_name(int units) { return us(units) ? "in" : "mm"; }
const char *un_temp_name(int units) { return us(units) ? "\u00b0F" : "\u00b0C"; }
const char *un_area_key(int units) { return us(units) ? "ac" : "ha"; }
const char *un_cover_key(int units) { return us(units) ? "lbdm_ac" : "kgdm_ha"; }
const char *un_mass_key(int units) { return us(units) ? "ston" : "t"; }
const char *un_height_key(int units) { return us(units) ? "in" : "cm"; }

int un_parse(const char *text, int *units)
{
    if (strcmp(text, "metric") == 0)
        *units = SITE_UNITS_METRIC;
    else if (strcmp(text, "us") == 0)
        *units = SITE_UNITS_US;
    else
        return -1;
    return 0;
}
