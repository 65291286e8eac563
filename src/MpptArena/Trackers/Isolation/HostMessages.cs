namespace MpptArena.Trackers.Isolation;

/// <summary>Encoding and decoding of the protocol's payloads, shared by the arena and the host.</summary>
public static class HostMessages
{
    /// <summary>Builds HELLO.</summary>
    public static FrameBuilder Hello(FrameBuilder b, HostHello h)
    {
        b.Begin(FrameType.Hello).U32(h.ProtocolVersion).U32(h.Flags).U8(h.CommandKind == TrackerCommandKind.DutyCycle ? (byte)1 : (byte)0)
            .Text(h.Summary).U32((uint)h.Parameters.Count);
        foreach (var p in h.Parameters) b.Text(p.Name).Text(p.Unit).F64(p.Default).F64(p.Min).F64(p.Max).Text(p.Description);
        return b;
    }

    /// <summary>Decodes the HELLO just read.</summary>
    public static HostHello ReadHello(FrameReader r)
    {
        if (r.Type != FrameType.Hello) throw new ProtocolException($"the first frame is {r.Type}, expected Hello");
        uint version = r.U32(), flags = r.U32();
        byte kind = r.U8();
        if (kind > 1) throw new ProtocolException($"HELLO names command kind {kind}; expected 0 (voltage reference) or 1 (duty cycle)");
        string summary = r.Text();
        uint count = r.U32();
        if (count > 1000) throw new ProtocolException($"HELLO declares {count} parameters");
        var list = new List<TrackerParameter>();
        for (int k = 0; k < count; k++)
        {
            string name = r.Text(), unit = r.Text();
            double def = r.F64(), min = r.F64(), max = r.F64();
            string description = r.Text();
            if (!(min <= def && def <= max)) throw new ProtocolException($"parameter '{name}' has default {def} outside its range [{min}, {max}]");
            list.Add(new TrackerParameter(name, unit, def, min, max, description));
        }
        return new HostHello(version, flags, kind == 1 ? TrackerCommandKind.DutyCycle : TrackerCommandKind.VoltageReference, summary, list);
    }

    /// <summary>Builds CREATE.</summary>
    public static FrameBuilder Create(FrameBuilder b, TrackerContext c, IReadOnlyList<KeyValuePair<string, double>> parameters)
    {
        b.Begin(FrameType.Create).F64(c.SamplePeriodS).F64(c.MinCommand).F64(c.MaxCommand).F64(c.NominalOpenCircuitVoltageV)
            .F64(c.NominalShortCircuitCurrentA).F64(c.VoltageLsbV).F64(c.CurrentLsbA).I32(c.VoltageBits).I32(c.CurrentBits)
            .U32((uint)parameters.Count);
        foreach (var (name, value) in parameters) b.Text(name).F64(value);
        return b;
    }

    /// <summary>Decodes the CREATE just read.</summary>
    public static (TrackerContext Context, Dictionary<string, double> Parameters) ReadCreate(FrameReader r)
    {
        var c = new TrackerContext(r.F64(), r.F64(), r.F64(), r.F64(), r.F64(), r.F64(), r.F64(), r.I32(), r.I32());
        uint count = r.U32();
        var values = new Dictionary<string, double>(StringComparer.Ordinal);
        for (int k = 0; k < count; k++) values[r.Text()] = r.F64();
        return (c, values);
    }

    /// <summary>Builds STEP.</summary>
    public static FrameBuilder Step(FrameBuilder b, uint sequence, in TrackerMeasurement m)
    {
        var (vSum, iSum, n) = CodeSums(m);
        return b.Begin(FrameType.Step).U32(sequence).F64(m.TimeS).F64(m.VoltageV).F64(m.CurrentA).I64(vSum).I64(iSum).I32(n).I32(0).F64(m.PreviousCommand);
    }

    /// <summary>Decodes the STEP just read (after its sequence number).</summary>
    public static TrackerMeasurement ReadMeasurement(FrameReader r)
    {
        double t = r.F64(), v = r.F64(), i = r.F64();
        long vSum = r.I64(), iSum = r.I64();
        int n = Math.Max(r.I32(), 1);
        r.I32();
        return new TrackerMeasurement(t, v, i, (double)vSum / n, (double)iSum / n, r.F64(), n);
    }

    /// <summary>Builds ERROR.</summary>
    public static FrameBuilder Error(FrameBuilder b, string kind, string message, string details) =>
        b.Begin(FrameType.Error).Text(kind).Text(message).Text(details);

    /// <summary>The code sums and conversion count a measurement carries on the wire, as the C ABI has them.</summary>
    public static (long VoltageCodeSum, long CurrentCodeSum, int Conversions) CodeSums(in TrackerMeasurement m)
    {
        int n = Math.Max(m.Conversions, 1);
        return ((long)Math.Round(m.VoltageCode * n), (long)Math.Round(m.CurrentCode * n), n);
    }
}
