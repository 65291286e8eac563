/*
 * mppt_arena_tracker.h: the C ABI through which a shared library (.so, .dll, .dylib) provides a
 * maximum-power-point tracker to MpptArena. ABI version 1.
 *
 * A library exports these functions with C linkage and the platform's default C calling convention:
 *
 *   required
 *     uint32_t mppt_arena_abi_version(void);            must return MPPT_ARENA_ABI_VERSION
 *     int32_t  mppt_arena_command_kind(void);           MPPT_ARENA_VOLTAGE_REFERENCE or MPPT_ARENA_DUTY_CYCLE
 *     void*    mppt_arena_create(const mppt_arena_parameter* parameters, int32_t parameter_count,
 *                                const mppt_arena_context* context, double* initial_command);
 *     double   mppt_arena_step(void* tracker, const mppt_arena_measurement* measurement);
 *     void     mppt_arena_destroy(void* tracker);
 *   optional (lets scenario checks, sweeps and reports know the parameters)
 *     int32_t  mppt_arena_parameter_count(void);
 *     int32_t  mppt_arena_describe_parameter(int32_t index, mppt_arena_parameter_info* info);  0 = ok
 *
 * Timing: mppt_arena_step is called at t_k = k T (T = context->sample_period_s). The measurement holds
 * the conversions taken in the averaging window ending at t_k. The returned command takes effect at
 * t_k and holds until the next call. mppt_arena_create returns the command for t = 0 in
 * *initial_command, or NULL on failure. The arena never calls a tracker from two threads at once.
 *
 * By default (isolation: process) every instance runs in a host process of its own, from a private
 * copy of the library, so file-scope globals are the instance's own and start as the file
 * initialises them; a crash, exit(), abort(), endless loop or runaway allocation stops this tracker
 * alone and is reported with the time and call. printf output goes to the tracker's log. With
 * isolation: in_process instances share the library's globals and a crash ends the arena.
 *
 * A returned command that is NaN, infinite or outside [context->min_command, context->max_command]
 * stops the tracker; the run reports it as failed and the other trackers go on.
 */
#ifndef MPPT_ARENA_TRACKER_H
#define MPPT_ARENA_TRACKER_H

#include <stdint.h>

#ifdef __cplusplus
extern "C" {
#endif

#define MPPT_ARENA_ABI_VERSION 1u

#define MPPT_ARENA_VOLTAGE_REFERENCE 0
#define MPPT_ARENA_DUTY_CYCLE 1

#if defined(_WIN32)
#define MPPT_ARENA_EXPORT __declspec(dllexport)
#else
#define MPPT_ARENA_EXPORT __attribute__((visibility("default")))
#endif

/* What the tracker may know about its hardware before it starts. */
typedef struct mppt_arena_context {
    double sample_period_s;                /* the tracker's sample period [s] */
    double min_command;                    /* lowest accepted command [V or duty] */
    double max_command;                    /* highest accepted command [V or duty] */
    double nominal_open_circuit_voltage_v; /* array Voc at STC [V] */
    double nominal_short_circuit_current_a;/* array Isc at STC [A] */
    double voltage_lsb_v;                  /* voltage ADC step [V/count] */
    double current_lsb_a;                  /* current ADC step [A/count] */
    int32_t voltage_bits;                  /* voltage ADC resolution [bits] */
    int32_t current_bits;                  /* current ADC resolution [bits] */
} mppt_arena_context;

/* One sample, as fixed-point firmware sees it (code sums) and in SI units. */
typedef struct mppt_arena_measurement {
    double time_s;             /* sample instant [s] */
    double voltage_v;          /* averaged voltage, scaled [V] */
    double current_a;          /* averaged current, scaled [A] */
    int64_t voltage_code_sum;  /* sum of the voltage ADC codes of this sample [counts] */
    int64_t current_code_sum;  /* sum of the current ADC codes of this sample [counts] */
    int32_t conversions;       /* number of conversions summed (>= 1) */
    int32_t reserved;          /* zero */
    double previous_command;   /* command in force until now [V or duty] */
} mppt_arena_measurement;

/* One parameter value given to mppt_arena_create. */
typedef struct mppt_arena_parameter {
    const char* name;          /* UTF-8, as declared */
    double value;
} mppt_arena_parameter;

/* A declared parameter: name (snake_case with a unit suffix), unit, default and range. */
typedef struct mppt_arena_parameter_info {
    const char* name;
    const char* unit;
    double default_value;
    double min_value;
    double max_value;
    const char* description;
} mppt_arena_parameter_info;

typedef uint32_t (*mppt_arena_abi_version_fn)(void);
typedef int32_t (*mppt_arena_command_kind_fn)(void);
typedef void* (*mppt_arena_create_fn)(const mppt_arena_parameter*, int32_t, const mppt_arena_context*, double*);
typedef double (*mppt_arena_step_fn)(void*, const mppt_arena_measurement*);
typedef void (*mppt_arena_destroy_fn)(void*);
typedef int32_t (*mppt_arena_parameter_count_fn)(void);
typedef int32_t (*mppt_arena_describe_parameter_fn)(int32_t, mppt_arena_parameter_info*);

#ifdef __cplusplus
}
#endif

#endif /* MPPT_ARENA_TRACKER_H */
