using MpptArena.Trackers;
using MpptArena.Trackers.Isolation;

namespace MpptArena.Host;

/// <summary>The host's request loop: CREATE, STEP (by frame or through the shared slot), DESTROY, MAP, until its input ends.</summary>
internal sealed class HostServer(IHostedSource source, IReadOnlyList<TrackerParameter> declared, FrameReader reader, FrameBuilder builder, Stream output)
{
    private IMpptTracker? _tracker;
    private Action? _release;
    private SharedStepSlot? _slot;
    private long _lastRequest;

    public void Serve()
    {
        while (true)
        {
            if (_slot is not null)
            {
                bool framePending = false, ended = false;
                bool stepped = _slot.AwaitRequest(_lastRequest, () =>
                {
                    if (!reader.Next())
                    {
                        ended = true;
                        return false;
                    }
                    if (reader.Type == FrameType.Wake) return true;
                    framePending = true;
                    return false;
                });
                if (stepped)
                {
                    SlotStep();
                    continue;
                }
                if (ended) return;
                if (!framePending) continue;
            }
            else if (!reader.NextSkippingWakes())
            {
                return;
            }
            Handle();
        }
    }

    private void Handle()
    {
        switch (reader.Type)
        {
            case FrameType.Create:
                Create();
                break;
            case FrameType.Step:
                FrameStep();
                break;
            case FrameType.Destroy:
                Release();
                builder.Begin(FrameType.Destroyed).SendTo(output);
                break;
            case FrameType.Map:
                _slot = SharedStepSlot.Open(reader.Text());
                _lastRequest = _slot.RequestSequence;
                builder.Begin(FrameType.Mapped).SendTo(output);
                break;
            case FrameType.Wake:
                break;
            default:
                throw new ProtocolException($"unexpected {reader.Type} frame");
        }
    }

    private void Create()
    {
        Release();
        var (context, values) = HostMessages.ReadCreate(reader);
        try
        {
            var (tracker, release) = source.Create(new TrackerSettings(declared, values));
            _tracker = tracker;
            _release = release;
            double first = tracker.Reset(context);
            builder.Begin(FrameType.Created).F64(first).SendTo(output);
        }
        catch (Exception ex)
        {
            Program.SendError(builder, output, ex is ArenaInputException ? "refused its parameters" : $"threw {ex.GetType().Name}", ex);
        }
    }

    private void FrameStep()
    {
        uint sequence = reader.U32();
        var m = HostMessages.ReadMeasurement(reader);
        if (TryStep(m, out double command, out var error))
        {
            builder.Begin(FrameType.Command).U32(sequence).F64(command).SendTo(output);
        }
        else
        {
            Program.SendError(builder, output, $"threw {error!.GetType().Name}", error);
        }
    }

    private void SlotStep()
    {
        var slot = _slot!;
        long sequence = slot.RequestSequence;
        _lastRequest = sequence;
        var m = slot.ReadRequest();
        if (TryStep(m, out double command, out var error))
        {
            if (slot.PublishReply(sequence, 0, command)) builder.Begin(FrameType.Wake).SendTo(output);
            return;
        }
        // The error frame goes first, so an arena that sees status 1 finds it on the pipe.
        Program.SendError(builder, output, $"threw {error!.GetType().Name}", error);
        if (slot.PublishReply(sequence, 1, double.NaN)) builder.Begin(FrameType.Wake).SendTo(output);
    }

    private bool TryStep(in TrackerMeasurement m, out double command, out Exception? error)
    {
        if (_tracker is null)
        {
            command = double.NaN;
            error = new InvalidOperationException("STEP before CREATE");
            return false;
        }
        try
        {
            command = _tracker.Step(m);
            error = null;
            return true;
        }
        catch (Exception ex)
        {
            command = double.NaN;
            error = ex;
            return false;
        }
    }

    public void Release()
    {
        _release?.Invoke();
        _release = null;
        _tracker = null;
    }
}
