/*
 * Perturb and observe in fixed point, written the way converter firmware is: the measurement arrives
 * as sums of raw ADC codes, power is compared as an integer product of code sums, and the voltage
 * reference is held in Q16.16 ADC-code units. Only the returned command is converted to volts, at the
 * boundary of the arena's C ABI (mppt_arena_tracker.h).
 *
 * Method: N. Femia, G. Petrone, G. Spagnuolo, M. Vitelli, "Optimization of perturb and observe maximum
 * power point tracking method", IEEE Trans. Power Electronics 20(4), 2005. It makes the same decisions
 * as the arena's built-in perturb_observe; only the Q16 rounding of the step and of the reference differ.
 */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "mppt_arena_tracker.h"

#define Q 16
#define ONE_Q (1 << Q)

typedef struct {
    int64_t reference_q;     /* voltage reference [ADC codes, Q16.16] */
    int64_t step_q;          /* perturbation [ADC codes, Q16.16] */
    int64_t min_q, max_q;    /* command range [ADC codes, Q16.16] */
    int64_t previous_power;  /* voltage code sum x current code sum of the previous sample */
    int32_t direction;       /* +1 or -1 */
    double lsb_v;            /* volts per code, only to convert the command */
} po_fixed;

static const mppt_arena_parameter_info parameters[] = {
    {"step_v", "V", 2.0, 1e-3, 1e4, "Perturbation of the voltage reference per sample"},
    {"start_fraction", "-", 0.8, 0.0, 1.2, "Initial reference as a fraction of the array's STC open-circuit voltage"},
};

static int64_t to_q(double volts, double lsb_v) { return (int64_t)llround(volts / lsb_v * ONE_Q); }

static int64_t clamp_q(int64_t x, int64_t lo, int64_t hi) { return x < lo ? lo : x > hi ? hi : x; }

MPPT_ARENA_EXPORT uint32_t mppt_arena_abi_version(void) { return MPPT_ARENA_ABI_VERSION; }

MPPT_ARENA_EXPORT int32_t mppt_arena_command_kind(void) { return MPPT_ARENA_VOLTAGE_REFERENCE; }

MPPT_ARENA_EXPORT int32_t mppt_arena_parameter_count(void) { return (int32_t)(sizeof parameters / sizeof parameters[0]); }

MPPT_ARENA_EXPORT int32_t mppt_arena_describe_parameter(int32_t index, mppt_arena_parameter_info* info)
{
    if (index < 0 || index >= mppt_arena_parameter_count() || info == NULL) return 1;
    *info = parameters[index];
    return 0;
}

MPPT_ARENA_EXPORT void* mppt_arena_create(const mppt_arena_parameter* given, int32_t count,
                                          const mppt_arena_context* context, double* initial_command)
{
    double step_v = parameters[0].default_value, start_fraction = parameters[1].default_value;
    for (int32_t k = 0; k < count; k++) {
        if (strcmp(given[k].name, "step_v") == 0) step_v = given[k].value;
        else if (strcmp(given[k].name, "start_fraction") == 0) start_fraction = given[k].value;
    }
    po_fixed* t = (po_fixed*)calloc(1, sizeof *t);
    if (t == NULL || context->voltage_lsb_v <= 0) { free(t); return NULL; }
    t->lsb_v = context->voltage_lsb_v;
    t->step_q = to_q(step_v, t->lsb_v);
    t->min_q = to_q(context->min_command, t->lsb_v);
    t->max_q = to_q(context->max_command, t->lsb_v);
    t->reference_q = clamp_q(to_q(start_fraction * context->nominal_open_circuit_voltage_v, t->lsb_v), t->min_q, t->max_q);
    t->direction = -1;
    t->previous_power = 0;
    *initial_command = (double)t->reference_q / ONE_Q * t->lsb_v;
    return t;
}

MPPT_ARENA_EXPORT double mppt_arena_step(void* state, const mppt_arena_measurement* m)
{
    po_fixed* t = (po_fixed*)state;
    int64_t power = m->voltage_code_sum * m->current_code_sum;
    if (power < t->previous_power) t->direction = -t->direction;
    t->previous_power = power;
    t->reference_q = clamp_q(t->reference_q + t->direction * t->step_q, t->min_q, t->max_q);
    return (double)t->reference_q / ONE_Q * t->lsb_v;
}

MPPT_ARENA_EXPORT void mppt_arena_destroy(void* state) { free(state); }
