using MpptArena.Tests.Plugins;

namespace MpptArena.Tests.Isolation;

/// <summary>
/// C trackers with the bugs firmware really has, compiled at test time. Each is a perturb and observe that
/// keeps its state in file-scope globals, as microcontroller code does, with one fault injected after
/// t = 0.5 s.
/// </summary>
internal static class FaultyLibraries
{
    private const string Template = """
        #include <math.h>
        #include <signal.h>
        #include <stdio.h>
        #include <stdlib.h>
        #include <string.h>
        #include <unistd.h>
        #include "mppt_arena_tracker.h"

        /* Firmware style: the whole state in globals, initialised once at load. */
        static double g_reference = 0.0;
        static double g_last_power = 0.0;
        static double g_step = 2.0;
        static double g_direction = 1.0;
        static int g_instance_token = 0;

        static int recurse(int n) { volatile char pad[4096]; pad[0] = (char)n; return recurse(n + 1) + pad[0]; }

        MPPT_ARENA_EXPORT uint32_t mppt_arena_abi_version(void) { return MPPT_ARENA_ABI_VERSION; }
        MPPT_ARENA_EXPORT int32_t mppt_arena_command_kind(void) { return MPPT_ARENA_VOLTAGE_REFERENCE; }
        MPPT_ARENA_EXPORT void* mppt_arena_create(const mppt_arena_parameter* p, int32_t n, const mppt_arena_context* c, double* first)
        {
            (void)p; (void)n;
            /* Deliberately does not reset g_last_power or g_direction: only a fresh load does. */
            g_reference = 0.7 * c->nominal_open_circuit_voltage_v;
            g_instance_token++;
            *first = g_reference;
            return &g_reference;
        }
        MPPT_ARENA_EXPORT double mppt_arena_step(void* t, const mppt_arena_measurement* m)
        {
            (void)t;
            if (m->time_s > 0.5) { FAULT }
            double power = m->voltage_v * m->current_a;
            if (power < g_last_power) g_direction = -g_direction;
            g_last_power = power;
            g_reference += g_direction * g_step * g_instance_token;
            return g_reference;
        }
        MPPT_ARENA_EXPORT void mppt_arena_destroy(void* t) { (void)t; }
        """;

    /// <summary>Builds the globals P&amp;O with <paramref name="fault"/> (C statements) run at every step after 0.5 s.</summary>
    public static string Build(string name, string fault = "") =>
        CCompiler.SharedLibrary(CCompiler.Folder(), name, Template.Replace("FAULT", fault));
}
