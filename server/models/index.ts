import type { Sequelize } from 'sequelize';
import { User } from './user.model';
import { Shop } from './shop.model';
import { ClassGroup } from './class-group.model';
import { ClassMember } from './class-member.model';
import { Session } from './session.model';
import { Sketch } from './sketch.model';
import { SketchRevision } from './sketch-revision.model';
import { Upload } from './upload.model';
import { UploadChunk } from './upload-chunk.model';
import { MailQueueItem } from './mail-queue-item.model';
import { OutboxMessage } from './outbox-message.model';
import { PasswordReset } from './password-reset.model';
import { ShareRecipient } from './share-recipient.model';
import { ClassInvite } from './class-invite.model';
import { Assignment } from './assignment.model';
import { AssignmentCopy } from './assignment-copy.model';
import { HandIn } from './hand-in.model';
import { Feedback } from './feedback.model';

export {
  User,
  Shop,
  ClassGroup,
  ClassMember,
  Session,
  Sketch,
  SketchRevision,
  Upload,
  UploadChunk,
  MailQueueItem,
  OutboxMessage,
  PasswordReset,
  ShareRecipient,
  ClassInvite,
  Assignment,
  AssignmentCopy,
  HandIn,
  Feedback,
};
export { shareModes, type ShareMode } from './sketch.model';
export { mailStates, type MailState } from './mail-queue-item.model';
export { roles, toPublicUser, type Role, type PublicUser } from './user.model';

/** The database the models are bound to (by initModels): the one every table of the app lives in. */
export function boundDatabase(): Sequelize {
  const sequelize = User.sequelize;
  if (!sequelize) throw new Error('the models are not bound to a database yet (initModels)');
  return sequelize;
}

/** Binds every model to `sequelize` and declares the associations, in one place. Tables come from migrations. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [
    User,
    Shop,
    ClassGroup,
    ClassMember,
    Session,
    Sketch,
    SketchRevision,
    Upload,
    UploadChunk,
    MailQueueItem,
    OutboxMessage,
    PasswordReset,
    ShareRecipient,
    ClassInvite,
    Assignment,
    AssignmentCopy,
    HandIn,
    Feedback,
  ])
    model.initModel(sequelize);

  Shop.hasMany(User, { foreignKey: 'shopId', as: 'members' });
  User.belongsTo(Shop, { foreignKey: 'shopId', as: 'shop' });

  ClassGroup.belongsTo(User, { foreignKey: 'instructorId', as: 'instructor' });
  ClassGroup.belongsToMany(User, { through: ClassMember, foreignKey: 'classId', otherKey: 'userId', as: 'students' });
  User.belongsToMany(ClassGroup, { through: ClassMember, foreignKey: 'userId', otherKey: 'classId', as: 'classes' });

  User.hasMany(Sketch, { foreignKey: 'ownerId', as: 'sketches' });
  Sketch.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Sketch.belongsTo(ClassGroup, { foreignKey: 'shareClassId', as: 'shareClass' });
  Sketch.hasMany(SketchRevision, { foreignKey: 'sketchId', as: 'revisions' });
  SketchRevision.belongsTo(Sketch, { foreignKey: 'sketchId' });
  Sketch.hasMany(Upload, { foreignKey: 'sketchId', as: 'uploads' });
  Upload.belongsTo(Sketch, { foreignKey: 'sketchId' });

  Sketch.hasMany(ShareRecipient, { foreignKey: 'sketchId', as: 'recipients' });
  ShareRecipient.belongsTo(Sketch, { foreignKey: 'sketchId' });

  ClassGroup.hasMany(ClassInvite, { foreignKey: 'classId', as: 'invites' });
  ClassGroup.hasMany(Assignment, { foreignKey: 'classId', as: 'assignments' });
  Assignment.belongsTo(ClassGroup, { foreignKey: 'classId', as: 'class' });
  HandIn.belongsTo(User, { foreignKey: 'studentId', as: 'student' });
  HandIn.hasOne(Feedback, { foreignKey: 'handInId', as: 'feedback' });
  Feedback.belongsTo(User, { foreignKey: 'authorId', as: 'author' });

  User.hasMany(PasswordReset, { foreignKey: 'userId' });
  PasswordReset.belongsTo(User, { foreignKey: 'userId' });
}
